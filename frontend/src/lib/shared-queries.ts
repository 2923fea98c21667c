/**
 * Query keys and reads that several features share. Every feature's changes show on the move (its history, guards
 * and stage), the run sheets list moves, and drivers are users; so the roots of the moves' and users' keys and the
 * moves list live here, and each feature's key factory (`features/<f>/api/keys.ts`) builds on them.
 */
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { MoveStage, MovesPage, MovesQuery } from '@amberline/common';
import { api } from './api-client';

export type MovesFilter = Required<Pick<MovesQuery, 'page' | 'pageSize'>> & { stage?: MoveStage; search?: string; sort?: MovesQuery['sort']; jurisdiction?: string };

export const sharedKeys = {
  /** Every move query: lists, counts, each move and what hangs off it. */
  moves: () => ['moves'] as const,
  movesList: (f: MovesFilter) => ['moves', 'list', f] as const,
  /** One move and everything read about it (schedule, history, assessment). */
  move: (id: string) => ['moves', 'one', id] as const,
  moveHistory: (id: string) => ['moves', 'one', id, 'history'] as const,
  /** Every user query, drivers included. */
  users: () => ['users'] as const,
};

export const getMoves = (f: MovesFilter) => {
  const q = new URLSearchParams({ page: String(f.page), pageSize: String(f.pageSize) });
  if (f.stage) q.set('stage', f.stage);
  if (f.search) q.set('search', f.search);
  if (f.sort) q.set('sort', f.sort);
  if (f.jurisdiction) q.set('jurisdiction', f.jurisdiction);
  return api<MovesPage>(`/moves?${q}`);
};

export const movesQueryOptions = (f: MovesFilter) => queryOptions({ queryKey: sharedKeys.movesList(f), queryFn: () => getMoves(f), placeholderData: keepPreviousData });
