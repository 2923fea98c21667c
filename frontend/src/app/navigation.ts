import type { Role } from '@amberline/common';
import { paths } from '../config/paths';
import { accessFor, type Access } from '../lib/access';

export type NavItem = { path: string; label: string };

const ITEMS: (NavItem & { allow: keyof Access | null; roles?: Role[] })[] = [
  { path: paths.home, label: 'Overview', allow: null, roles: ['admin', 'dispatcher', 'permit_clerk'] },
  { path: paths.moves, label: 'Moves', allow: 'canSeeMoves' },
  { path: paths.permits, label: 'Permit desk', allow: 'canSeePermitDesk' },
  { path: paths.payments, label: 'Payments', allow: 'canSeePayments' },
  { path: paths.vendors, label: 'Escort vendors', allow: 'canManageVendors' },
  { path: paths.runSheets, label: 'Run sheets', allow: null, roles: ['driver'] },
  { path: paths.fleet, label: 'Fleet', allow: 'canSeeFleet' },
  { path: paths.rulebook, label: 'Rulebook', allow: 'canSeeRulebook' },
  { path: paths.users, label: 'Users', allow: 'canManageUsers' },
];

/** The main navigation for a role, in the order it shows. */
export function navigationFor(role: Role | undefined): NavItem[] {
  const access = accessFor(role);
  return ITEMS.filter((i) => (i.allow ? access[i.allow] : !!role && (i.roles ?? []).includes(role))).map(({ path, label }) => ({ path, label }));
}
