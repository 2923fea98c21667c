import { ROLES, type Role } from './roles';

/**
 * What each role may do, by permission. The server's `@Roles(permission)` on every route and the front end's
 * access map (menus and route guards) both read this table, so the two cannot drift apart.
 */
export const PERMISSIONS = {
  /** Who am I: every signed-in role. */
  'session.read': ROLES,
  /** Moves, their assessment, schedule and history (a driver sees the moves assigned to them). */
  'moves.read': ['admin', 'dispatcher', 'permit_clerk', 'driver'],
  /** Open, plan, stage, reopen and re-assess moves. */
  'moves.edit': ['admin', 'dispatcher'],
  /** Compare a move's kept rules with the rulebook's current ones. */
  'moves.compareRules': ['admin', 'dispatcher', 'permit_clerk'],
  /** The permit queue, its overview and who works it. */
  'permits.queue': ['admin', 'dispatcher', 'permit_clerk'],
  /** One permit, a move's permits and their PDFs (the driver carries them). */
  'permits.read': ['admin', 'dispatcher', 'permit_clerk', 'driver'],
  /** Bring a move's permits in line with its assessment. */
  'permits.sync': ['admin', 'dispatcher', 'permit_clerk'],
  /** File, record, attach, assign, pay and refund permits. */
  'permits.work': ['admin', 'permit_clerk'],
  /** The fee payments ledger and its export. */
  'payments.read': ['admin', 'dispatcher', 'permit_clerk'],
  'fleet.read': ['admin', 'dispatcher', 'permit_clerk'],
  'fleet.edit': ['admin'],
  'rulebook.read': ['admin', 'dispatcher', 'permit_clerk'],
  'rulebook.edit': ['admin'],
  /** A move's escort bookings. */
  'escorts.read': ['admin', 'dispatcher', 'permit_clerk'],
  /** Ask vendors for escorts and call bookings off. */
  'escorts.book': ['admin', 'dispatcher'],
  /** The escort vendors' directory. */
  'vendors.manage': ['admin', 'dispatcher'],
  /** A move's run sheet and its PDF. */
  'runSheets.read': ['admin', 'dispatcher', 'permit_clerk', 'driver'],
  /** The departure checks recorded for a move (the run sheet screens). */
  'departureChecks.read': ['admin', 'dispatcher', 'driver'],
  /** Record departure checks and acknowledge the run sheet: the driver's own word. */
  'departureChecks.record': ['driver'],
  /** Let a gauge finding pass on the desk's responsibility. */
  'departureChecks.override': ['admin', 'dispatcher'],
  /** Drivers to assign to a move. */
  'drivers.read': ['admin', 'dispatcher'],
  'users.manage': ['admin'],
  /** The outgoing mail log and its retries. */
  'mail.manage': ['admin'],
} as const satisfies Record<string, readonly Role[]>;
export type Permission = keyof typeof PERMISSIONS;

export function rolesWith(permission: Permission): readonly Role[] {
  return PERMISSIONS[permission];
}

export function can(role: Role | undefined | null, permission: Permission): boolean {
  return !!role && (PERMISSIONS[permission] as readonly Role[]).includes(role);
}
