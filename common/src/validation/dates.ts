/**
 * Strict date and time formats, shared by the server's DTOs and the engine. Only the forms the API speaks are
 * accepted: a calendar date `YYYY-MM-DD`, a local wall-clock time `YYYY-MM-DDTHH:mm`, and a full ISO 8601 date-time
 * with its offset. Week dates (`2026-W49-3`), ordinal dates (`2026-336`) and impossible days (`2026-02-30`) are not
 * dates here: `Date` cannot read the first two and PostgreSQL refuses the last.
 */

const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;
const LOCAL_DATE_TIME_RE = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2})$/;
const DATE_TIME_RE = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2})(?::(\d{2})(?:\.\d{1,9})?)?(Z|[+-](\d{2}):(\d{2}))$/i;

const isLeapYear = (y: number): boolean => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
const daysInMonth = (y: number, m: number): number => [31, isLeapYear(y) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][m - 1];

/** The parts of a `YYYY-MM-DD` string that names a real day of the Gregorian calendar (years 0001–9999), else null. */
export function calendarDate(value: unknown): { y: number; m: number; d: number } | null {
  const match = typeof value === 'string' ? DATE_RE.exec(value) : null;
  if (!match) return null;
  const [y, m, d] = match.slice(1).map(Number);
  if (y < 1 || m < 1 || m > 12 || d < 1 || d > daysInMonth(y, m)) return null;
  return { y, m, d };
}

/** True for `YYYY-MM-DD` naming a real calendar day. */
export const isCalendarDate = (value: unknown): value is string => calendarDate(value) !== null;

/** True for a local wall-clock time `YYYY-MM-DDTHH:mm` on a real calendar day, 00:00–23:59. */
export function isLocalDateTime(value: unknown): value is string {
  const match = typeof value === 'string' ? LOCAL_DATE_TIME_RE.exec(value) : null;
  return !!match && isCalendarDate(match[1]) && Number(match[2]) <= 23 && Number(match[3]) <= 59;
}

/**
 * True for a full ISO 8601 date-time with its offset, `YYYY-MM-DDTHH:mm[:ss[.fff]]` then `Z` or `±HH:MM`, on a real
 * calendar day (a time without an offset would be read in the server's own zone, so it is not accepted).
 */
export function isIsoDateTime(value: unknown): value is string {
  const match = typeof value === 'string' ? DATE_TIME_RE.exec(value) : null;
  if (!match || !isCalendarDate(match[1])) return false;
  const [h, mi, s, oh, om] = [match[2], match[3], match[4] ?? '0', match[6] ?? '0', match[7] ?? '0'].map(Number);
  if (h > 23 || mi > 59 || s > 59 || oh > 23 || om > 59) return false;
  const instant = new Date(value as string);
  return Number.isFinite(instant.getTime()) && instant.getUTCFullYear() >= 1 && instant.getUTCFullYear() <= 9999;
}
