import { formatFeetInches, formatPounds } from '@amberline/common';

/** Feet and inches, or a dash for a value the engine could not give. */
export const ftIn = (inches: number | null | undefined): string => (inches === null || inches === undefined || !Number.isFinite(inches) || inches < 0 ? '—' : formatFeetInches(inches));
export const lb = (pounds: number | null | undefined): string => (pounds === null || pounds === undefined || !Number.isFinite(pounds) || pounds < 0 ? '—' : formatPounds(pounds));

export { calendarDate, localInstant } from '../../lib/time';

/** `HH:MM` wall clock of an instant in a zone. */
export function localClock(iso: string | null | undefined, timeZone: string): string | null {
  if (!iso) return null;
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return null;
  try {
    return new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(d);
  } catch {
    return null;
  }
}

/** `HH:MM` → minutes after midnight (24:00 → 1440). */
export function minutesOf(hhmm: string | null | undefined): number | null {
  const m = /^(\d{1,2}):(\d{2})$/.exec(hhmm ?? '');
  return m ? Number(m[1]) * 60 + Number(m[2]) : null;
}

export const humanize = (code: string): string => code.replace(/_/g, ' ').replace(/-/g, ' ');
