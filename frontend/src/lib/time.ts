/** Instants as people read them: always with the zone named. */

/** An instant in a jurisdiction's own zone (the viewer's when none is given): `Tue, Jan 12, 07:14 CST`. */
export function localInstant(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  try {
    return new Intl.DateTimeFormat('en-US', { timeZone, weekday: 'short', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short' }).format(d);
  } catch {
    return d.toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
  }
}

/** `2027-01-12` → `Tue 12 Jan 2027` (a calendar date, no time zone involved). */
export function calendarDate(date: string | null | undefined): string {
  if (!date) return '—';
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(date);
  if (!m) return date;
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return new Intl.DateTimeFormat('en-US', { timeZone: 'UTC', weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }).format(d);
}

/** `2026-12-10 00:01 CST`: an instant as local date and time in the zone, with the zone's short name. */
export function zonedDateTime(iso: string | null | undefined, timeZone: string): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat('en-US', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short' })
      .formatToParts(d)
      .map((p) => [p.type, p.value]),
  );
  return `${parts.year}-${parts.month}-${parts.day} ${parts.hour}:${parts.minute} ${parts.timeZoneName}`;
}

/** A validity window in the state's zone: `2026-12-10 00:01 CST – 2026-12-13 23:59 CST`. */
export const zonedRange = (from: string | null, to: string | null, timeZone: string): string => (from && to ? `${zonedDateTime(from, timeZone)} – ${zonedDateTime(to, timeZone)}` : '—');
