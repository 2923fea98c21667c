import { localToInstant, PermitFieldProblem, sanitizeFileName } from '@amberline/common';
import { fieldError } from '../core/app-exception';

/** Runs a permit rule of common; a value it cannot use becomes the 400 naming the request's field. */
export function asFieldError<T>(rule: () => T): T {
  try {
    return rule();
  } catch (e) {
    if (e instanceof PermitFieldProblem) throw fieldError(e.field, e.reason);
    throw e;
  }
}

/** `YYYY-MM-DDTHH:mm` in the state's zone → the instant, or a 400 naming `field`. */
export const localInstantOf = (local: string, timeZone: string, field: string): Date => asFieldError(() => localToInstant(local, timeZone, field));

/** The stored name of an uploaded PDF, or a 400 naming the field `file`. */
export const storedFileName = (raw: string | undefined): string => asFieldError(() => sanitizeFileName(raw));
