import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MoveStage, MovesPage, MovesQuery } from '@amberline/common';
import { api } from '../../../lib/api-client';

export type MovesFilter = Required<Pick<MovesQuery, 'page' | 'pageSize'>> & { stage?: MoveStage; search?: string; sort?: MovesQuery['sort']; jurisdiction?: string };

export const getMoves = (f: MovesFilter) => {
  const q = new URLSearchParams({ page: String(f.page), pageSize: String(f.pageSize) });
  if (f.stage) q.set('stage', f.stage);
  if (f.search) q.set('search', f.search);
  if (f.sort) q.set('sort', f.sort);
  if (f.jurisdiction) q.set('jurisdiction', f.jurisdiction);
  return api<MovesPage>(`/moves?${q}`);
};

export const movesQueryOptions = (f: MovesFilter) =>
  queryOptions({ queryKey: ['moves', 'list', f], queryFn: () => getMoves(f), placeholderData: keepPreviousData });

export const useMoves = (f: MovesFilter) => useQuery(movesQueryOptions(f));
