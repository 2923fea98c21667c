import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PermitOverviewDto } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const getPermitOverview = () => api<PermitOverviewDto>('/permits/overview');

export const permitOverviewQueryOptions = () => queryOptions({ queryKey: ['permits', 'overview'], queryFn: getPermitOverview });

export const usePermitOverview = () => useQuery(permitOverviewQueryOptions());
