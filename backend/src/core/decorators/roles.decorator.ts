import { SetMetadata } from '@nestjs/common';
import { rolesWith, type Permission } from '@amberline/common';

export const ROLES_KEY = 'roles';
/**
 * What a handler needs, as a permission of common's PERMISSIONS table (the front end's access map reads the same
 * table); the guard lets in the roles that hold it. Every private handler must say; a handler without it is refused.
 */
export const Roles = (permission: Permission) => SetMetadata(ROLES_KEY, rolesWith(permission));
