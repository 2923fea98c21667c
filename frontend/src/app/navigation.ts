import type { Role } from '@amberline/common';
import { paths } from '../config/paths';
import { accessFor } from '../lib/access';

export type NavItem = { path: string; label: string };

/** The main navigation for a role, in the order it shows. */
export function navigationFor(role: Role | undefined): NavItem[] {
  const access = accessFor(role);
  const items: NavItem[] = [{ path: paths.home, label: 'Overview' }];
  if (access.canManageUsers) items.push({ path: paths.users, label: 'Users' });
  return items;
}
