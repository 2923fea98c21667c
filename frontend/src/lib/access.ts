import type { Role } from '@amberline/common';

/** What each role may see. Menus and route guards both read this map; the server checks again. */
export function accessFor(role: Role | undefined) {
  return {
    canManageUsers: role === 'admin',
  };
}
export type Access = ReturnType<typeof accessFor>;
