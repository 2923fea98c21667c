/** The session's own calls: sign in and who am I. They belong to the session (lib/auth.tsx), not to a feature. */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LoginRequest, LoginResponse, SessionUser } from '@amberline/common';
import { api, tokenStore } from './api-client';

/** The session's query keys. */
export const authKeys = {
  all: () => ['auth'] as const,
  me: () => ['auth', 'me'] as const,
};

export const login = (body: LoginRequest) => api<LoginResponse>('/auth/login', { method: 'POST', json: body });

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: () => api<SessionUser>('/auth/me'), enabled: !!tokenStore.get(), retry: false });

export const useMe = () => useQuery(meQueryOptions());
