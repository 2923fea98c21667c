import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MoveDto, StageChangeRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const changeStage = ({ id, ...body }: StageChangeRequest & { id: string }) => api<MoveDto>(`/moves/${id}/stage`, { method: 'POST', json: body });

export const useChangeStage = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: changeStage, onSuccess: () => qc.invalidateQueries({ queryKey: moveKeys.all() }) });
};
