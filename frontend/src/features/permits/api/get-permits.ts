import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PermitsPage, PermitsQuery } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { permitKeys } from './keys';

export type PermitsFilter = Required<Pick<PermitsQuery, 'page' | 'pageSize' | 'sort'>> & Omit<PermitsQuery, 'page' | 'pageSize' | 'sort'>;

export const getPermits = (f: PermitsFilter) => {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== undefined && v !== '') q.set(k, String(v));
  return api<PermitsPage>(`/permits?${q}`);
};

export const permitsQueryOptions = (f: PermitsFilter) =>
  queryOptions({ queryKey: permitKeys.list(f), queryFn: () => getPermits(f), placeholderData: keepPreviousData });

export const usePermits = (f: PermitsFilter) => useQuery(permitsQueryOptions(f));
