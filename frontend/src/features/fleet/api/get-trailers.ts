import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrailerDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

export const getTrailers = () => api<TrailerDto[]>('/fleet/trailers');

export const trailersQueryOptions = () => queryOptions({ queryKey: fleetKeys.trailers(), queryFn: getTrailers, staleTime: 60_000 });

export const useTrailers = () => useQuery(trailersQueryOptions());
