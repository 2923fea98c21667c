import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { permitKeys } from './keys';

export type Assignee = { id: string; name: string; role: string };

export const getAssignees = () => api<Assignee[]>('/permits/assignees');

export const assigneesQueryOptions = () => queryOptions({ queryKey: permitKeys.assignees(), queryFn: getAssignees, staleTime: 60_000 });

export const useAssignees = (enabled = true) => useQuery({ ...assigneesQueryOptions(), enabled });
