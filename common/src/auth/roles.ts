/** Roles that sign in. Escort vendors never get accounts: they answer through a signed e-mail link. */
export const ROLES = ['admin', 'dispatcher', 'permit_clerk', 'driver'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  dispatcher: 'Dispatcher',
  permit_clerk: 'Permit clerk',
  driver: 'Driver',
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
