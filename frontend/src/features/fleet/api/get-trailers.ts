import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrailerDto } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const getTrailers = () => api<TrailerDto[]>('/fleet/trailers');

export const trailersQueryOptions = () => queryOptions({ queryKey: ['fleet', 'trailers'], queryFn: getTrailers, staleTime: 60_000 });

export const useTrailers = () => useQuery(trailersQueryOptions());
