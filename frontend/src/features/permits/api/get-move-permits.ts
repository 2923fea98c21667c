import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PermitDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { permitKeys } from './keys';

export const getMovePermits = (moveId: string) => api<PermitDto[]>(`/moves/${moveId}/permits`);

export const movePermitsQueryOptions = (moveId: string) =>
  queryOptions({
    queryKey: permitKeys.move(moveId),
    queryFn: () => getMovePermits(moveId),
    refetchInterval: (q) => (q.state.data?.some((p) => p.paymentStatus === 'processing') ? 1500 : false),
  });

export const useMovePermits = (moveId: string) => useQuery(movePermitsQueryOptions(moveId));
