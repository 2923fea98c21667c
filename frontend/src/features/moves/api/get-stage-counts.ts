import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StageCounts } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const getStageCounts = () => api<StageCounts>('/moves/stage-counts');

export const stageCountsQueryOptions = () => queryOptions({ queryKey: moveKeys.stageCounts(), queryFn: getStageCounts });

export const useStageCounts = () => useQuery(stageCountsQueryOptions());
