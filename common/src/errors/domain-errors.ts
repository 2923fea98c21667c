import type { FieldError } from './error-codes';

/**
 * Why the desk refused an action, in the trade's terms. Services throw a DomainError with one of these; the
 * server's exception filter turns each into its HTTP status from one table, and the browser reacts to the code
 * (never to the wording of the message, which is for people).
 */
export const DOMAIN_ERRORS = {
  /** Someone else saved the record after you read it (its version moved on): reload and redo. */
  VERSION_CONFLICT: 'version_conflict',
  /** The run sheet changed after the driver opened it: reload, read again, acknowledge the new version. */
  RUN_SHEET_CHANGED: 'run_sheet_changed',
  /** A stage or status may not go from where it is to where it was asked (or its conditions are unmet). */
  TRANSITION_REFUSED: 'transition_refused',
  /** The record is closed (delivered, cancelled, void): it takes no more changes. */
  RECORD_CLOSED: 'record_closed',
  /** Something else must happen first (departure checks recorded, checks passed, a permit issued, …). */
  PRECONDITION_UNMET: 'precondition_unmet',
  /** Only an issued permit's fee is paid. */
  PERMIT_NOT_ISSUED: 'permit_not_issued',
  /** It is already done (paid, attached, passed, answered). */
  ALREADY_DONE: 'already_done',
  /** The value or slot is held by another record (an e-mail address, an escort position). */
  ALREADY_TAKEN: 'already_taken',
  /** Too late for this way of doing it (a link for a move about to depart, a reopen long after delivery). */
  TOO_LATE: 'too_late',
  /** An admin may not lock themselves out. */
  SELF_LOCKOUT: 'self_lockout',
  /** The payment processor refused the operation. */
  PROCESSOR_REFUSED: 'processor_refused',
  /** The escort request behind a vendor's link is answered or closed. */
  LINK_CLOSED: 'link_closed',
  /** The record asked for does not exist (or the caller may not see it). */
  NOT_FOUND: 'not_found',
  /** The record existed but is gone for good (an expired link). */
  GONE: 'gone',
} as const;
export type DomainErrorCode = (typeof DOMAIN_ERRORS)[keyof typeof DOMAIN_ERRORS];

/** A refusal by the rules of the desk; carries its code, a sentence for people and optional details. */
export class DomainError extends Error {
  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly details?: FieldError[] | Record<string, unknown>,
  ) {
    super(message);
    this.name = 'DomainError';
  }
}
