import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionUser } from '@amberline/common';
import { api, tokenStore } from '../../../lib/api-client';

export const meQueryOptions = () =>
  queryOptions({ queryKey: ['auth', 'me'], queryFn: () => api<SessionUser>('/auth/me'), enabled: !!tokenStore.get(), retry: false });

export const useMe = () => useQuery(meQueryOptions());
