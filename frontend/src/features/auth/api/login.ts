import { useMutation } from '@tanstack/react-query';
import type { LoginRequest, LoginResponse } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const login = (body: LoginRequest) => api<LoginResponse>('/auth/login', { method: 'POST', json: body });

export const useLogin = () => useMutation({ mutationFn: login });
