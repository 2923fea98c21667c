/** Input validation: negative, NaN and absurd values are rejected with a RangeError naming the field. */
import { calendarDate } from '../validation/dates';

export type NumberBounds = {
  min?: number;
  max?: number;
  /** Reject the minimum itself (value must be greater than `min`). */
  minExclusive?: boolean;
  integer?: boolean;
  unit?: string;
};

/** Throws a RangeError naming `field` unless `value` is a finite number within the bounds. Returns the value. */
export function checkNumber(field: string, value: unknown, bounds: NumberBounds = {}): number {
  const unit = bounds.unit ? ` ${bounds.unit}` : '';
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${field} must be a finite number; got ${String(value)}`);
  }
  if (bounds.integer && !Number.isInteger(value)) {
    throw new RangeError(`${field} must be a whole number; got ${value}`);
  }
  if (bounds.min !== undefined) {
    if (bounds.minExclusive ? value <= bounds.min : value < bounds.min) {
      throw new RangeError(
        `${field} must be ${bounds.minExclusive ? 'greater than' : 'at least'} ${bounds.min}${unit}; got ${value}${unit}`,
      );
    }
  }
  if (bounds.max !== undefined && value > bounds.max) {
    throw new RangeError(`${field} must be at most ${bounds.max}${unit} (absurd value); got ${value}${unit}`);
  }
  return value;
}

/** Plausibility ceilings. Generous for superloads, tight enough to catch unit mix-ups. */
export const ABSURD = {
  lengthIn: 6000, // 500 ft
  widthIn: 1200, // 100 ft
  heightIn: 600, // 50 ft
  lengthFt: 500,
  weightLb: 2_000_000,
  axleWeightLb: 200_000,
  miles: 10_000,
  psi: 300,
} as const;

export const checkLengthIn = (field: string, v: unknown, min = 0): number =>
  checkNumber(field, v, { min, max: ABSURD.lengthIn, unit: 'in' });
export const checkWeightLb = (field: string, v: unknown, max: number = ABSURD.weightLb): number =>
  checkNumber(field, v, { min: 0, max, unit: 'lb' });

/** Parses `YYYY-MM-DD` strictly (a real calendar day, between 1900 and 2200); RangeError otherwise. */
export function parseIsoDate(field: string, value: unknown): { y: number; m: number; d: number } {
  if (typeof value !== 'string') throw new RangeError(`${field} must be a YYYY-MM-DD date string; got ${String(value)}`);
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) throw new RangeError(`${field} must be a YYYY-MM-DD date string; got "${value}"`);
  const date = calendarDate(value);
  if (!date || date.y < 1900 || date.y > 2200) {
    throw new RangeError(`${field} is not a real calendar date between 1900 and 2200; got "${value}"`);
  }
  return date;
}
