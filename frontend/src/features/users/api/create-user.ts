import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateUserRequest, UserDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { userKeys } from './keys';

export const createUser = (body: CreateUserRequest) => api<UserDto>('/users', { method: 'POST', json: body });

export const useCreateUser = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createUser, onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all() }) });
};
