import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TractorDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

export const getTractor = (id: string) => api<TractorDto>(`/fleet/tractors/${id}`);

export const tractorQueryOptions = (id: string) => queryOptions({ queryKey: fleetKeys.tractor(id), queryFn: () => getTractor(id), staleTime: 60_000 });

export const useTractor = (id: string | undefined) => useQuery({ ...tractorQueryOptions(id ?? ''), enabled: !!id });
