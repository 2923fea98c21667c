import { useQuery } from '@tanstack/react-query';
import { movesQueryOptions, type MovesFilter } from '../../../lib/shared-queries';

/** A page of moves; the fetcher and its query options are shared (the run sheets list moves too). */
export const useMoves = (f: MovesFilter) => useQuery(movesQueryOptions(f));
