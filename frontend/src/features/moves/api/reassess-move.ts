import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MoveDto, ReassessRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const reassessMove = ({ id, ...body }: ReassessRequest & { id: string }) => api<MoveDto>(`/moves/${id}/reassess`, { method: 'POST', json: body });

export const useReassessMove = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: reassessMove, onSuccess: () => qc.invalidateQueries({ queryKey: moveKeys.all() }) });
};
