import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CancelEscortBookingRequest, EscortBookingDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { escortKeys } from './keys';
import { sharedKeys } from '../../../lib/shared-queries';

export const cancelEscort = ({ moveId, bookingId, ...body }: CancelEscortBookingRequest & { moveId: string; bookingId: string }) =>
  api<EscortBookingDto>(`/moves/${moveId}/escort-bookings/${bookingId}/cancel`, { method: 'POST', json: body });

export const useCancelEscort = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: cancelEscort,
    onSuccess: (_b, v) =>
      Promise.all([qc.invalidateQueries({ queryKey: escortKeys.move(v.moveId) }), qc.invalidateQueries({ queryKey: sharedKeys.moveHistory(v.moveId) })]),
  });
};
