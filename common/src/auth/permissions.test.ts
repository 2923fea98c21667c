import { can, PERMISSIONS, rolesWith, type Permission } from './permissions';
import { ROLES } from './roles';

describe('permissions', () => {
  it('name only roles that sign in, each permission held by at least one role', () => {
    for (const [permission, roles] of Object.entries(PERMISSIONS)) {
      expect({ permission, ok: roles.length > 0 && roles.every((r) => (ROLES as readonly string[]).includes(r)) }).toEqual({ permission, ok: true });
    }
  });

  it('keep the desk roles apart: the driver records checks, the clerk works permits, only the admin edits the rulebook', () => {
    expect(rolesWith('departureChecks.record')).toEqual(['driver']);
    expect(can('dispatcher', 'permits.work')).toBe(false);
    expect(can('permit_clerk', 'permits.work')).toBe(true);
    expect(ROLES.filter((r) => can(r, 'rulebook.edit'))).toEqual(['admin']);
    expect(can('driver', 'moves.edit')).toBe(false);
    expect(can(undefined, 'session.read')).toBe(false);
    expect(ROLES.every((r) => can(r, 'session.read'))).toBe(true);
  });

  it('give the driver read access to what rides in the cab: moves assigned, permits and their PDFs, the run sheet', () => {
    const driver: Permission[] = ['moves.read', 'permits.read', 'runSheets.read', 'departureChecks.read'];
    expect(driver.filter((p) => !can('driver', p))).toEqual([]);
  });
});
