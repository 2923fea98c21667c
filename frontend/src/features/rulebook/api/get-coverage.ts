import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RulebookCoverage } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { rulebookKeys } from './keys';

export const getCoverage = () => api<RulebookCoverage>('/rulebook/coverage');

export const coverageQueryOptions = () => queryOptions({ queryKey: rulebookKeys.coverage(), queryFn: getCoverage });

export const useRulebookCoverage = () => useQuery(coverageQueryOptions());
