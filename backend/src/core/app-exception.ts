import { HttpException } from '@nestjs/common';
import type { ErrorCode, FieldError } from '@amberline/common';

/** A domain error with a stable code; the exception filter turns it into the JSON error body. */
export class AppException extends HttpException {
  constructor(
    status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: FieldError[] | Record<string, unknown>,
    /** Response headers to send with the error (e.g. Retry-After on 429 and 503). */
    readonly headers?: Record<string, string>,
  ) {
    super({ message, code, details }, status);
  }
}

export const fieldError = (field: string, reason: string, status = 400) =>
  new AppException(status, 'validation_failed', `${field}: ${reason}`, [{ field, reason }]);
