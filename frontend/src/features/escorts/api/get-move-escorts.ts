import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MoveEscortsDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { escortKeys } from './keys';

export const getMoveEscorts = (moveId: string) => api<MoveEscortsDto>(`/moves/${moveId}/escort-bookings`);

export const moveEscortsQueryOptions = (moveId: string) => queryOptions({ queryKey: escortKeys.move(moveId), queryFn: () => getMoveEscorts(moveId) });

/** Polls while the page is open, so a vendor's answer shows within seconds. */
export const useMoveEscorts = (moveId: string) => useQuery({ ...moveEscortsQueryOptions(moveId), refetchInterval: 5_000, refetchOnWindowFocus: true, staleTime: 0 });
