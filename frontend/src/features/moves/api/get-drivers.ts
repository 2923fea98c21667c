import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export type DriverOption = { id: string; name: string; email: string };

export const getDrivers = () => api<DriverOption[]>('/users/drivers');

export const driversQueryOptions = () => queryOptions({ queryKey: moveKeys.drivers(), queryFn: getDrivers, staleTime: 60_000 });

export const useDrivers = (enabled = true) => useQuery({ ...driversQueryOptions(), enabled });
