import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JurisdictionSummaryDto } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const getJurisdictions = () => api<JurisdictionSummaryDto[]>('/rulebook/jurisdictions');

export const jurisdictionsQueryOptions = () => queryOptions({ queryKey: ['rulebook', 'list'], queryFn: getJurisdictions, staleTime: 60_000 });

export const useJurisdictions = () => useQuery(jurisdictionsQueryOptions());
