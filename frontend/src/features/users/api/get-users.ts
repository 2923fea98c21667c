import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Page, Role, UserDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { userKeys } from './keys';

export type UsersFilter = { page: number; pageSize: number; role?: Role; search?: string };

export const getUsers = (f: UsersFilter) => {
  const q = new URLSearchParams({ page: String(f.page), pageSize: String(f.pageSize) });
  if (f.role) q.set('role', f.role);
  if (f.search) q.set('search', f.search);
  return api<Page<UserDto>>(`/users?${q}`);
};

export const usersQueryOptions = (f: UsersFilter) =>
  queryOptions({ queryKey: userKeys.list(f), queryFn: () => getUsers(f), placeholderData: keepPreviousData });

export const useUsers = (f: UsersFilter) => useQuery(usersQueryOptions(f));
