import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MoveDto, MoveInput } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const createMove = (body: MoveInput) => api<MoveDto>('/moves', { method: 'POST', json: body });

export const useCreateMove = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createMove, onSuccess: () => qc.invalidateQueries({ queryKey: moveKeys.all() }) });
};
