import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MoveDto, UpdateMoveRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

/** Sends the version the form was loaded with; a stale one is refused with 409 and nothing is overwritten. */
export const updateMove = ({ id, ...body }: UpdateMoveRequest & { id: string }) => api<MoveDto>(`/moves/${id}`, { method: 'PATCH', json: body });

export const useUpdateMove = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateMove, onSuccess: () => qc.invalidateQueries({ queryKey: moveKeys.all() }) });
};
