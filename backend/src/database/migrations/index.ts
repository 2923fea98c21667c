import { UsersAndSignIn1764610000000 } from './1764610000000-users-and-sign-in';
import { FleetRulebookMoves1764620000000 } from './1764620000000-fleet-rulebook-moves';

/** Every migration, in order. Add new ones at the end; never edit one that has landed. */
export const MIGRATIONS = [UsersAndSignIn1764610000000, FleetRulebookMoves1764620000000];
