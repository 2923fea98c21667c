/** Local wall-clock conversion with Intl.DateTimeFormat and an IANA zone (no time-zone library). */

const DAY_MS = 86_400_000;
const formatters = new Map<string, Intl.DateTimeFormat>();
/** Offsets memoised per zone and 15-minute UTC bucket (zone transitions fall on quarter hours). */
const offsetCache = new Map<string, number>();
const OFFSET_CACHE_MAX = 20_000;

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    try {
      f = new Intl.DateTimeFormat('en-US', {
        timeZone,
        hourCycle: 'h23',
        year: 'numeric',
        month: 'numeric',
        day: 'numeric',
        hour: 'numeric',
        minute: 'numeric',
        second: 'numeric',
      });
    } catch {
      throw new RangeError(`timeZone must be an IANA time zone such as America/Chicago; got "${timeZone}"`);
    }
    formatters.set(timeZone, f);
  }
  return f;
}

/** Throws a RangeError unless `timeZone` is a zone this runtime knows. */
export function checkTimeZone(timeZone: unknown): string {
  if (typeof timeZone !== 'string' || timeZone === '') {
    throw new RangeError(`timeZone must be an IANA time zone such as America/Chicago; got ${String(timeZone)}`);
  }
  formatter(timeZone);
  return timeZone;
}

/** Minutes the zone is ahead of UTC at this instant (e.g. −300 for US Eastern standard time). */
export function zoneOffsetMinutes(timeZone: string, epochMs: number): number {
  const bucket = Math.floor(epochMs / 900_000);
  const key = `${timeZone}|${bucket}`;
  const hit = offsetCache.get(key);
  if (hit !== undefined) return hit;
  const parts = formatter(timeZone).formatToParts(new Date(bucket * 900_000));
  let y = 0;
  let mo = 0;
  let d = 0;
  let h = 0;
  let mi = 0;
  let s = 0;
  for (const p of parts) {
    switch (p.type) {
      case 'year':
        y = Number(p.value);
        break;
      case 'month':
        mo = Number(p.value);
        break;
      case 'day':
        d = Number(p.value);
        break;
      case 'hour':
        h = Number(p.value);
        break;
      case 'minute':
        mi = Number(p.value);
        break;
      case 'second':
        s = Number(p.value);
        break;
      default:
        break;
    }
  }
  const asUtc = Date.UTC(y, mo - 1, d, h, mi, s);
  const offset = Math.round((asUtc - bucket * 900_000) / 60_000);
  if (offsetCache.size >= OFFSET_CACHE_MAX) offsetCache.clear();
  offsetCache.set(key, offset);
  return offset;
}

/** Empties the offset memo (for benchmarks measuring a cold start). */
export function clearTimeZoneCache(): void {
  offsetCache.clear();
}

/**
 * The UTC instant of a local wall-clock time. In a spring-forward gap the time is read with the offset before
 * the change (so 02:30 becomes 03:30); in a fall-back overlap the earlier instant is returned.
 */
export function zonedTimeToUtc(dayNumber: number, minutesOfDay: number, timeZone: string): number {
  const wall = dayNumber * DAY_MS + minutesOfDay * 60_000;
  const o1 = zoneOffsetMinutes(timeZone, wall);
  const t = wall - o1 * 60_000;
  const o2 = zoneOffsetMinutes(timeZone, t);
  if (o2 === o1) return t;
  const t2 = wall - o2 * 60_000;
  if (zoneOffsetMinutes(timeZone, t2) === o2) return t2;
  // Inside a spring-forward gap: keep the reading with the offset before the change.
  return t;
}

/** `HH:MM` local wall-clock time of an instant. */
export function localClock(epochMs: number, timeZone: string): string {
  const local = new Date(epochMs + zoneOffsetMinutes(timeZone, epochMs) * 60_000);
  return `${String(local.getUTCHours()).padStart(2, '0')}:${String(local.getUTCMinutes()).padStart(2, '0')}`;
}

/** Local calendar date `YYYY-MM-DD` of an instant. */
export function localDate(epochMs: number, timeZone: string): string {
  const local = new Date(epochMs + zoneOffsetMinutes(timeZone, epochMs) * 60_000);
  return local.toISOString().slice(0, 10);
}

/** Days since 1970-01-01 for a calendar date. */
export const dayNumberOf = (y: number, m: number, d: number): number => Date.UTC(y, m - 1, d) / DAY_MS;
/** 0 = Sunday … 6 = Saturday. */
export const weekdayOf = (dayNumber: number): number => (((dayNumber + 4) % 7) + 7) % 7;
export const isoOfDay = (dayNumber: number): string => new Date(dayNumber * DAY_MS).toISOString().slice(0, 10);

/** The zone's short name at that instant ("CST", "EDT"; "GMT-7" where the platform has no abbreviation). */
export function zoneAbbreviation(epochMs: number, timeZone: string): string {
  try {
    const part = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(new Date(epochMs)).find((p) => p.type === 'timeZoneName');
    return part?.value ?? timeZone;
  } catch {
    return timeZone;
  }
}

/** "2026-12-15 07:12 CST": an instant as local date and time in the zone, with the zone named. */
export const formatZoned = (epochMs: number, timeZone: string): string => `${localDate(epochMs, timeZone)} ${localClock(epochMs, timeZone)} ${zoneAbbreviation(epochMs, timeZone)}`;
