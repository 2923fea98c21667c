import { SetMetadata } from '@nestjs/common';
import type { Role } from '@amberline/common';

export const ROLES_KEY = 'roles';
/** The roles allowed on a handler. Every private handler must say; a handler without it is refused. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);
export const ALL_ROLES: Role[] = ['admin', 'dispatcher', 'permit_clerk', 'driver'];
