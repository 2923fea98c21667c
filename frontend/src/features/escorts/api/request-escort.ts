import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateEscortBookingRequest, EscortBookingDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { escortKeys } from './keys';
import { sharedKeys } from '../../../lib/shared-queries';

export const requestEscort = ({ moveId, ...body }: CreateEscortBookingRequest & { moveId: string }) =>
  api<EscortBookingDto>(`/moves/${moveId}/escort-bookings`, { method: 'POST', json: body });

export const useRequestEscort = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: requestEscort,
    onSuccess: (_b, v) => Promise.all([qc.invalidateQueries({ queryKey: escortKeys.move(v.moveId) }), qc.invalidateQueries({ queryKey: sharedKeys.moveHistory(v.moveId) })]),
  });
};
