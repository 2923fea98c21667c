import { applyDecorators } from '@nestjs/common';
import { Type } from 'class-transformer';
import { IsObject, ValidateBy, ValidateIf, ValidateNested, type ValidationOptions } from 'class-validator';
import { isCalendarDate, isIsoDateTime, isLocalDateTime } from '@amberline/common';

/** The name of the constraint `Omittable` adds; the validation pipe reports it alone for a null value. */
export const NOT_NULL = 'notNull';

/**
 * For a field a change may leave out (the stored value stays) but not clear: null is refused, with one reason,
 * instead of reaching a column that requires a value. `IsOptional` lets null through; use it only where null means
 * "none".
 */
export function Omittable(): PropertyDecorator {
  return applyDecorators(
    ValidateIf((_, v) => v !== undefined),
    ValidateBy({
      name: NOT_NULL,
      validator: { validate: (v) => v !== null, defaultMessage: (a) => `${a?.property} must not be null (leave it out to keep the current value)` },
    }),
  );
}

/**
 * A nested object validated as `type`, or with `each` a list of them: an array, string or null where an object
 * belongs is refused here rather than handed to the service as if it were one.
 */
export function Nested(type: () => new () => object, opts: { each?: boolean } = {}): PropertyDecorator {
  const message = opts.each ? 'each item of $property must be an object' : '$property must be an object';
  return applyDecorators(IsObject({ each: opts.each, message }), ValidateNested({ each: opts.each }), Type(type));
}

/**
 * Decimal places of a finite number as written in plain notation: 1e-7 has 7, 2.5e+3 has 0. (Splitting
 * `String(n)` at the point fails on exponent notation.)
 */
export function decimalPlaces(n: number): number {
  const m = /^-?\d+(?:\.(\d+))?(?:e([+-]\d+))?$/i.exec(String(n));
  if (!m) return Infinity;
  return Math.max(0, (m[1]?.length ?? 0) - Number(m[2] ?? 0));
}

/** A finite number with at most `places` decimals (an amount of money: 2). Pair with `IsNumber()`. */
export function MaxDecimals(places: number, options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'maxDecimals',
      validator: {
        // anything but a finite number is IsNumber's to refuse
        validate: (v) => typeof v !== 'number' || !Number.isFinite(v) || decimalPlaces(v) <= places,
        defaultMessage: (a) => `${a?.property} must have at most ${places} decimals`,
      },
    },
    options,
  );
}

/** `YYYY-MM-DD` naming a real calendar day (no week or ordinal dates, no 30 February). */
export function IsCalendarDate(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    { name: 'isCalendarDate', validator: { validate: (v) => isCalendarDate(v), defaultMessage: (a) => `${a?.property} must be a date, YYYY-MM-DD` } },
    options,
  );
}

/** A local wall-clock time `YYYY-MM-DDTHH:mm` on a real calendar day. */
export function IsLocalDateTime(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'isLocalDateTime',
      validator: { validate: (v) => isLocalDateTime(v), defaultMessage: (a) => `${a?.property} must be a local date and time, YYYY-MM-DDTHH:mm` },
    },
    options,
  );
}

/** A calendar day `YYYY-MM-DD` or a full ISO 8601 date-time with its offset (`2026-12-01T14:30:00Z`). */
export function IsDateOrDateTime(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'isDateOrDateTime',
      validator: {
        validate: (v) => isCalendarDate(v) || isIsoDateTime(v),
        defaultMessage: (a) => `${a?.property} must be a date YYYY-MM-DD or an ISO date and time with its offset`,
      },
    },
    options,
  );
}
