import type { Role } from '@amberline/common';

/** What each role may see and do. Menus and route guards both read this map; the server checks again. */
export function accessFor(role: Role | undefined) {
  const is = (...roles: Role[]) => !!role && roles.includes(role);
  return {
    canManageUsers: is('admin'),
    canSeeMoves: is('admin', 'dispatcher', 'permit_clerk'),
    canEditMoves: is('admin', 'dispatcher'),
    canSeeFleet: is('admin', 'dispatcher', 'permit_clerk'),
    canEditFleet: is('admin'),
    canSeeRulebook: is('admin', 'dispatcher', 'permit_clerk'),
    canEditRulebook: is('admin'),
    canSeePermitDesk: is('admin', 'dispatcher', 'permit_clerk'),
    canWorkPermits: is('admin', 'permit_clerk'),
    canSeePayments: is('admin', 'permit_clerk'),
    canManageVendors: is('admin', 'dispatcher'),
    canBookEscorts: is('admin', 'dispatcher'),
    canSeeRunSheets: is('admin', 'dispatcher', 'driver'),
  };
}
export type Access = ReturnType<typeof accessFor>;
