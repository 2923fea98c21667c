import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RulebookCoverage } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const getCoverage = () => api<RulebookCoverage>('/rulebook/coverage');

export const coverageQueryOptions = () => queryOptions({ queryKey: ['rulebook', 'coverage'], queryFn: getCoverage });

export const useRulebookCoverage = () => useQuery(coverageQueryOptions());
