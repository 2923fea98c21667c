import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrailerDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

export const getTrailer = (id: string) => api<TrailerDto>(`/fleet/trailers/${id}`);

export const trailerQueryOptions = (id: string) => queryOptions({ queryKey: fleetKeys.trailer(id), queryFn: () => getTrailer(id), staleTime: 60_000 });

export const useTrailer = (id: string | undefined) => useQuery({ ...trailerQueryOptions(id ?? ''), enabled: !!id });
