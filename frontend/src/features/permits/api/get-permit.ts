import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PermitDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { permitKeys } from './keys';

export const getPermit = (id: string) => api<PermitDto>(`/permits/${id}`);

export const permitQueryOptions = (id: string) =>
  queryOptions({
    queryKey: permitKeys.one(id),
    queryFn: () => getPermit(id),
    // a payment confirmed by the processor is marked paid when its signed event arrives: look again shortly
    refetchInterval: (q) => (q.state.data?.payments.some((p) => p.status === 'processing' || p.status === 'pending') ? 1000 : false),
  });

export const usePermit = (id: string | undefined) => useQuery({ ...permitQueryOptions(id ?? ''), enabled: !!id });
