import type { DomainErrorCode } from './domain-errors';

/** Stable error codes shared by server and browser. The server's exception filter puts one in `error`. */
export const ERROR_CODES = {
  VALIDATION_FAILED: 'validation_failed',
  BAD_REQUEST: 'bad_request',
  UNAUTHENTICATED: 'unauthenticated',
  FORBIDDEN: 'forbidden',
  NOT_FOUND: 'not_found',
  CONFLICT: 'conflict',
  TOO_MANY_REQUESTS: 'too_many_requests',
  PAYLOAD_TOO_LARGE: 'payload_too_large',
  UNSUPPORTED_MEDIA_TYPE: 'unsupported_media_type',
  SERVICE_UNAVAILABLE: 'service_unavailable',
  INTERNAL: 'internal_error',
} as const;
export type ErrorCode = (typeof ERROR_CODES)[keyof typeof ERROR_CODES];

/** One problem with one field of a request. */
export type FieldError = { field: string; reason: string };

/** The JSON body of every error the API returns. */
export type ApiErrorBody = {
  statusCode: number;
  error: ErrorCode;
  /** For refusals by the desk's rules: why, in the domain's terms (see DOMAIN_ERRORS). */
  code?: DomainErrorCode;
  message: string;
  details?: FieldError[] | Record<string, unknown>;
};
