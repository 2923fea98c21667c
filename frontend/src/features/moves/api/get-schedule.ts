import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ScheduleDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { moveKeys } from './keys';

export const getSchedule = (id: string) => api<ScheduleDto>(`/moves/${id}/schedule`);

export const scheduleQueryOptions = (id: string) => queryOptions({ queryKey: moveKeys.schedule(id), queryFn: () => getSchedule(id) });

export const useSchedule = (id: string) => useQuery(scheduleQueryOptions(id));
