import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MoveDto, ReopenRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const reopenMove = ({ id, ...body }: ReopenRequest & { id: string }) => api<MoveDto>(`/moves/${id}/reopen`, { method: 'POST', json: body });

export const useReopenMove = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: reopenMove, onSuccess: () => qc.invalidateQueries({ queryKey: moveKeys.all() }) });
};
