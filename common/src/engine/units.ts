/** Feet-inches and pounds parsing and formatting. Compute in inches and pounds; feet where a rule speaks feet. */
import { ABSURD, checkNumber } from './validate';

export const inToFt = (inches: number): number => inches / 12;
export const ftToIn = (feet: number): number => feet * 12;

const FEET_INCHES_RE =
  /^\s*(?:(\d+(?:\.\d+)?)\s*(?:'|′|ft\.?|feet|foot)\s*-?\s*)?(?:(\d+(?:\.\d+)?)(?:\s+(\d+)\/(\d+))?\s*(?:"|″|''|in\.?|inches|inch)\s*)?$/i;

/**
 * Parses a feet-inches string to inches: `14'2"`, `14' 2"`, `14'-2 1/2"`, `14 ft 2 in`, `14'`, `8"`.
 * A bare number is rejected (the unit is ambiguous). Inches must be under 12 when feet are given.
 */
export function parseFeetInches(text: string): number {
  if (typeof text !== 'string' || text.trim() === '') {
    throw new RangeError(`feet-inches value must be a non-empty string like 14'2"; got ${JSON.stringify(text)}`);
  }
  if (text.includes('-') && /^\s*-/.test(text)) {
    throw new RangeError(`feet-inches value must not be negative; got "${text}"`);
  }
  const m = FEET_INCHES_RE.exec(text);
  if (!m || (m[1] === undefined && m[2] === undefined)) {
    throw new RangeError(`feet-inches value "${text}" is not understood; write it like 14'2" or 14 ft 2 in`);
  }
  const feet = m[1] !== undefined ? Number(m[1]) : 0;
  let inches = m[2] !== undefined ? Number(m[2]) : 0;
  if (m[3] !== undefined && m[4] !== undefined) {
    const den = Number(m[4]);
    if (den === 0) throw new RangeError(`feet-inches value "${text}" has a zero denominator`);
    inches += Number(m[3]) / den;
  }
  if (m[1] !== undefined && inches >= 12) {
    throw new RangeError(`feet-inches value "${text}": inches must be under 12 when feet are given`);
  }
  const total = feet * 12 + inches;
  return checkNumber('feet-inches value', total, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
}

export type FeetInchesPrecision = 1 | 2 | 4 | 8;

/** Formats inches as feet-inches: `formatFeetInches(170)` → `14'2"`. `precision` = fractions of an inch (1 → whole inches). */
export function formatFeetInches(inches: number, precision: FeetInchesPrecision = 1): string {
  checkNumber('inches', inches, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
  const steps = Math.round(inches * precision);
  const feet = Math.floor(steps / (12 * precision));
  const rest = steps - feet * 12 * precision;
  const whole = Math.floor(rest / precision);
  const frac = rest - whole * precision;
  let inchText = String(whole);
  if (frac > 0) {
    let num = frac;
    let den: number = precision;
    while (num % 2 === 0 && den % 2 === 0) {
      num /= 2;
      den /= 2;
    }
    inchText = whole > 0 ? `${whole} ${num}/${den}` : `${num}/${den}`;
  }
  return `${feet}'${inchText}"`;
}

/** Groups thousands with commas, independent of the runtime's locale. */
function groupThousands(n: number): string {
  const s = String(Math.abs(n));
  let out = '';
  for (let i = 0; i < s.length; i++) {
    if (i > 0 && (s.length - i) % 3 === 0) out += ',';
    out += s[i];
  }
  return n < 0 ? `-${out}` : out;
}

/** `formatPounds(80000)` → `80,000 lb` (rounded to the whole pound). */
export function formatPounds(lb: number): string {
  checkNumber('pounds', lb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
  return `${groupThousands(Math.round(lb))} lb`;
}

/** `parsePounds("80,000 lb")` → 80000. Accepts `lb`, `lbs`, `#` or no unit; rejects negatives. */
export function parsePounds(text: string): number {
  if (typeof text !== 'string') throw new RangeError(`pounds value must be a string; got ${String(text)}`);
  const m = /^\s*(\d{1,3}(?:,\d{3})+|\d+)(\.\d+)?\s*(?:lbs?\.?|#|pounds?)?\s*$/i.exec(text);
  if (!m) throw new RangeError(`pounds value "${text}" is not understood; write it like 80,000 lb`);
  const value = Number(m[1].replace(/,/g, '') + (m[2] ?? ''));
  return checkNumber('pounds value', value, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
}

/** `formatUsd(265)` → `$265.00`. */
export function formatUsd(usd: number): string {
  checkNumber('amount', usd, { min: 0, unit: 'usd' });
  const cents = Math.round(usd * 100);
  const whole = Math.floor(cents / 100);
  return `$${groupThousands(whole)}.${String(cents % 100).padStart(2, '0')}`;
}
