import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TractorDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { fleetKeys } from './keys';

export const getTractors = () => api<TractorDto[]>('/fleet/tractors');

export const tractorsQueryOptions = () => queryOptions({ queryKey: fleetKeys.tractors(), queryFn: getTractors, staleTime: 60_000 });

export const useTractors = () => useQuery(tractorsQueryOptions());
