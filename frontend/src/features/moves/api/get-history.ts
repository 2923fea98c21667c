import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HistoryEntryDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const getMoveHistory = (id: string) => api<HistoryEntryDto[]>(`/moves/${id}/history`);

export const moveHistoryQueryOptions = (id: string) =>
  queryOptions({ queryKey: moveKeys.history(id), queryFn: () => getMoveHistory(id) });

export const useMoveHistory = (id: string) => useQuery(moveHistoryQueryOptions(id));
