import { can, type Role } from '@amberline/common';

/**
 * What each role may see and do, read from common's PERMISSIONS table — the one the server's `@Roles` reads — so a
 * menu never offers what the server refuses. Menus and route guards both read this map.
 */
export function accessFor(role: Role | undefined) {
  const may = (p: Parameters<typeof can>[1]) => can(role, p);
  return {
    canManageUsers: may('users.manage'),
    // the desk's move screens; a driver reaches their moves through the run sheets
    canSeeMoves: may('moves.edit') || may('permits.queue'),
    canEditMoves: may('moves.edit'),
    canSeeFleet: may('fleet.read'),
    canEditFleet: may('fleet.edit'),
    canSeeRulebook: may('rulebook.read'),
    canEditRulebook: may('rulebook.edit'),
    canSeePermitDesk: may('permits.queue'),
    canWorkPermits: may('permits.work'),
    canSeePayments: may('payments.read'),
    canManageVendors: may('vendors.manage'),
    canBookEscorts: may('escorts.book'),
    canSeeRunSheets: may('departureChecks.read'),
  };
}
export type Access = ReturnType<typeof accessFor>;
