import { UsersAndSignIn1764610000000 } from './1764610000000-users-and-sign-in';
import { FleetRulebookMoves1764620000000 } from './1764620000000-fleet-rulebook-moves';
import { PermitsAndPayments1764630000000 } from './1764630000000-permits-and-payments';
import { RunSheets1764650000000 } from './1764650000000-run-sheets';
import { PermitQueueOrder1764660000000 } from './1764660000000-permit-queue-order';
import { EscortsAndMail1764640000000 } from './1764640000000-escorts-and-mail';
import { RulebookFacts1764670000000 } from './1764670000000-rulebook-facts';
import { FrozenAssessments1764680000000 } from './1764680000000-frozen-assessments';
import { GeneratedColumnMetadata1764690000000 } from './1764690000000-generated-column-metadata';

/** Every migration, in order. Add new ones at the end; never edit one that has landed. */
export const MIGRATIONS = [
  UsersAndSignIn1764610000000,
  FleetRulebookMoves1764620000000,
  PermitsAndPayments1764630000000,
  EscortsAndMail1764640000000,
  RunSheets1764650000000,
  PermitQueueOrder1764660000000,
  RulebookFacts1764670000000,
  FrozenAssessments1764680000000,
  GeneratedColumnMetadata1764690000000,
];
