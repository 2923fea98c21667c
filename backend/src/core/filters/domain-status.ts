import { DOMAIN_ERRORS, ERROR_CODES, type DomainErrorCode, type ErrorCode } from '@amberline/common';

/** Each refusal of the desk's rules as HTTP: its status and the generic error code beside the domain code. */
export const DOMAIN_STATUS: Record<DomainErrorCode, { status: number; error: ErrorCode }> = {
  [DOMAIN_ERRORS.VERSION_CONFLICT]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.RUN_SHEET_CHANGED]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.TRANSITION_REFUSED]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.RECORD_CLOSED]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.PRECONDITION_UNMET]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.PERMIT_NOT_ISSUED]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.ALREADY_DONE]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.ALREADY_TAKEN]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.TOO_LATE]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.SELF_LOCKOUT]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.PROCESSOR_REFUSED]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.LINK_CLOSED]: { status: 409, error: ERROR_CODES.CONFLICT },
  [DOMAIN_ERRORS.NOT_FOUND]: { status: 404, error: ERROR_CODES.NOT_FOUND },
  [DOMAIN_ERRORS.GONE]: { status: 410, error: ERROR_CODES.NOT_FOUND },
};
