import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JurisdictionSummaryDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { rulebookKeys } from './keys';

export const getJurisdictions = () => api<JurisdictionSummaryDto[]>('/rulebook/jurisdictions');

export const jurisdictionsQueryOptions = () => queryOptions({ queryKey: rulebookKeys.list(), queryFn: getJurisdictions, staleTime: 60_000 });

export const useJurisdictions = () => useQuery(jurisdictionsQueryOptions());
