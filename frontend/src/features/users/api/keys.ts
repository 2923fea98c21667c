import { sharedKeys } from '../../../lib/shared-queries';
import type { UsersFilter } from './get-users';

/** The users' query keys. */
export const userKeys = {
  all: sharedKeys.users,
  list: (f: UsersFilter) => [...sharedKeys.users(), 'list', f] as const,
};
