import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StageCounts } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const getStageCounts = () => api<StageCounts>('/moves/stage-counts');

export const stageCountsQueryOptions = () => queryOptions({ queryKey: ['moves', 'stage-counts'], queryFn: getStageCounts });

export const useStageCounts = () => useQuery(stageCountsQueryOptions());
