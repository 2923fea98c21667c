import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PermitOverviewDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { permitKeys } from './keys';

export const getPermitOverview = () => api<PermitOverviewDto>('/permits/overview');

export const permitOverviewQueryOptions = () => queryOptions({ queryKey: permitKeys.overview(), queryFn: getPermitOverview });

export const usePermitOverview = () => useQuery(permitOverviewQueryOptions());
