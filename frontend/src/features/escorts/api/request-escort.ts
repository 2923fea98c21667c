import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateEscortBookingRequest, EscortBookingDto } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const requestEscort = ({ moveId, ...body }: CreateEscortBookingRequest & { moveId: string }) =>
  api<EscortBookingDto>(`/moves/${moveId}/escort-bookings`, { method: 'POST', json: body });

export const useRequestEscort = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: requestEscort,
    onSuccess: (_b, v) => Promise.all([qc.invalidateQueries({ queryKey: ['escorts', 'move', v.moveId] }), qc.invalidateQueries({ queryKey: ['moves', 'one', v.moveId, 'history'] })]),
  });
};
