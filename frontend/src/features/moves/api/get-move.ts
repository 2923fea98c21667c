import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MoveDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const getMove = (id: string) => api<MoveDto>(`/moves/${id}`);

export const moveQueryOptions = (id: string) => queryOptions({ queryKey: moveKeys.one(id), queryFn: () => getMove(id) });

export const useMove = (id: string | undefined) => useQuery({ ...moveQueryOptions(id ?? ''), enabled: !!id });
