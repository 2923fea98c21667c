import { UsersAndSignIn1764610000000 } from './1764610000000-users-and-sign-in';

/** Every migration, in order. Add new ones at the end; never edit one that has landed. */
export const MIGRATIONS = [UsersAndSignIn1764610000000];
