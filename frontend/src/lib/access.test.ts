import { PERMISSIONS, type Role } from '@amberline/common';
import { accessFor } from './access';

const ROLES: Role[] = ['admin', 'dispatcher', 'permit_clerk', 'driver'];
const who = (flag: keyof ReturnType<typeof accessFor>) => ROLES.filter((r) => accessFor(r)[flag]);

describe('accessFor', () => {
  it.each([
    ['canManageUsers', ['admin']],
    ['canEditMoves', ['admin', 'dispatcher']],
    // the desk's move screens: whoever edits moves or works the permit queue; a driver goes through the run sheets
    ['canSeeMoves', ['admin', 'dispatcher', 'permit_clerk']],
    ['canSeePermitDesk', ['admin', 'dispatcher', 'permit_clerk']],
    ['canSeeRunSheets', ['admin', 'dispatcher', 'driver']],
  ] as const)('%s: %j', (flag, roles) => {
    expect(who(flag)).toEqual(roles);
  });

  it("reads the server's permission table, so a menu never offers what the server refuses", () => {
    const pairs = [
      ['canSeeFleet', 'fleet.read'],
      ['canEditFleet', 'fleet.edit'],
      ['canSeeRulebook', 'rulebook.read'],
      ['canEditRulebook', 'rulebook.edit'],
      ['canWorkPermits', 'permits.work'],
      ['canSeePayments', 'payments.read'],
      ['canManageVendors', 'vendors.manage'],
      ['canBookEscorts', 'escorts.book'],
    ] as const;
    for (const [flag, permission] of pairs) expect(who(flag)).toEqual(ROLES.filter((r) => (PERMISSIONS[permission] as readonly Role[]).includes(r)));
  });

  it('grants nothing before anyone signs in', () => {
    expect(Object.values(accessFor(undefined)).some(Boolean)).toBe(false);
  });

  it('never lets a driver into the desk or the fleet', () => {
    const a = accessFor('driver');
    expect([a.canSeeMoves, a.canSeePermitDesk, a.canSeeFleet, a.canManageUsers]).toEqual([false, false, false, false]);
  });
});
