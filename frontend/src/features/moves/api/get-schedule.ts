import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ScheduleDto } from '@amberline/common';
import { api } from '../../../lib/api-client';

export const getSchedule = (id: string) => api<ScheduleDto>(`/moves/${id}/schedule`);

export const scheduleQueryOptions = (id: string) => queryOptions({ queryKey: ['moves', 'one', id, 'schedule'], queryFn: () => getSchedule(id) });

export const useSchedule = (id: string) => useQuery(scheduleQueryOptions(id));
