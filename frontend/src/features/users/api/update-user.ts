import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateUserRequest, UserDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { userKeys } from './keys';

export const updateUser = ({ id, ...body }: UpdateUserRequest & { id: string }) =>
  api<UserDto>(`/users/${id}`, { method: 'PATCH', json: body });

export const useUpdateUser = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateUser, onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all() }) });
};
