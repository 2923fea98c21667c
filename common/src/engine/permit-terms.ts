/**
 * An issued permit's own terms, recorded by the permit clerk in structured form. Once recorded, they govern the
 * state's travel windows and escorts in place of the rulebook (the permit is what the driver is held to), and the
 * differences from the rulebook are listed so the desk sees where the two disagree or the rulebook had nothing.
 */
import { describeDaylight, describeHolidays, describeWeekends } from './travel-describe';
import type { Curfew, DaylightRule, Fact, HolidayName, HolidayRule, KnownFact, TravelRules, WeekendBan } from './jurisdiction-rule';
import { isKnown } from './jurisdiction-rule';
import { HOLIDAY_NAMES } from './holidays';
import type { TravelWindowsResult } from './travel-windows';

/** The hours a permit allows travel: daylight with offsets, fixed local clock hours each day, or any hour. */
export type PermitTravelHours =
  | { kind: 'daylight'; startOffsetMin: number; endOffsetMin: number }
  | { kind: 'clock'; start: string; end: string }
  | { kind: 'any' };

/** The travel limits a permit states. A topic left out is not stated by the permit (the rulebook's value stays). */
export type PermitTravelTerms = {
  hours?: PermitTravelHours;
  /** Weekend limits; an empty list = the permit allows weekend travel. */
  weekendBans?: WeekendBan[];
  /** Holiday limits; an empty list of names = the permit sets none. */
  holidays?: Pick<HolidayRule, 'names' | 'from' | 'observance' | 'until'>;
  /** Curfews the permit names (they replace the rulebook's). */
  curfews?: Curfew[];
};

export const PERMIT_TRAVEL_TOPICS = ['hours', 'weekendBans', 'holidays', 'curfews'] as const;
export type PermitTravelTopic = (typeof PERMIT_TRAVEL_TOPICS)[number];

/** What one issued permit says, as the engine uses it. */
export type PermitTerms = {
  /** How the permit is named as a source, e.g. "OK permit 26-118842". */
  label: string;
  /** `YYYY-MM-DD`, the permit's issue date (its edition as a source). */
  issuedOn: string;
  travel?: PermitTravelTerms;
  /** The escorts the permit asks (0 = none). */
  escorts?: { front: number; rear: number; heightPole?: boolean };
  maxSpeedMph?: number;
};

/** A jurisdiction's result when an issued permit governs it. */
export type PermitGovernance = {
  label: string;
  /** What the permit decides here: `travel.hours`, `travel.weekends`, `travel.holidays`, `travel.curfews`, `escorts`. */
  topics: string[];
  /** Where the permit and the rulebook differ, or the rulebook had the topic not on file, in words. */
  differences: string[];
};

const CLOCK = /^([01]\d|2[0-3]):([0-5]\d)$/;
const CLOCK_END = /^(([01]\d|2[0-3]):([0-5]\d)|24:00)$/;
const HOLIDAY_FROM: readonly HolidayRule['from'][] = ['noon-weekday-before', 'noon-day-before', 'day-only'];
const OBSERVANCE: readonly HolidayRule['observance'][] = ['actual', 'observed', 'both'];

const isObject = (v: unknown): v is Record<string, unknown> => !!v && typeof v === 'object' && !Array.isArray(v);

function onlyKeys(field: string, v: Record<string, unknown>, allowed: readonly string[]): void {
  for (const k of Object.keys(v)) if (!allowed.includes(k)) throw new RangeError(`${field}.${k} is not a permit condition (use ${allowed.join(', ')})`);
}

function offset(field: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < -240 || v > 240) throw new RangeError(`${field} must be whole minutes from -240 to 240`);
  return v;
}

function clock(field: string, v: unknown, end = false): string {
  if (typeof v !== 'string' || !(end ? CLOCK_END : CLOCK).test(v)) throw new RangeError(`${field} must be a local time HH:MM${end ? ' (24:00 for midnight at the end of the day)' : ''}`);
  return v;
}

function days(field: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < 0 || v > 6) throw new RangeError(`${field} must be a day 0 (Sunday) to 6 (Saturday)`);
  return v;
}

/**
 * Checks the travel terms a clerk records and returns them clean. Throws a RangeError whose message starts with
 * the field (`travel.hours.start must be …`). Unknown topics are refused, so a typo is never silently dropped.
 */
export function checkPermitTravelTerms(raw: unknown, field = 'travel'): PermitTravelTerms {
  if (!isObject(raw)) throw new RangeError(`${field} must be an object with any of ${PERMIT_TRAVEL_TOPICS.join(', ')}`);
  onlyKeys(field, raw, PERMIT_TRAVEL_TOPICS);
  const out: PermitTravelTerms = {};
  if (raw.hours !== undefined) {
    const h = raw.hours;
    const f = `${field}.hours`;
    if (!isObject(h)) throw new RangeError(`${f} must be an object with kind daylight, clock or any`);
    if (h.kind === 'daylight') {
      onlyKeys(f, h, ['kind', 'startOffsetMin', 'endOffsetMin']);
      out.hours = { kind: 'daylight', startOffsetMin: offset(`${f}.startOffsetMin`, h.startOffsetMin ?? 0), endOffsetMin: offset(`${f}.endOffsetMin`, h.endOffsetMin ?? 0) };
    } else if (h.kind === 'clock') {
      onlyKeys(f, h, ['kind', 'start', 'end']);
      const start = clock(`${f}.start`, h.start);
      const end = clock(`${f}.end`, h.end, true);
      if (end <= start) throw new RangeError(`${f}.end must be after ${f}.start (${start}); hours crossing midnight go as two permits' days or a curfew`);
      out.hours = { kind: 'clock', start, end };
    } else if (h.kind === 'any') {
      onlyKeys(f, h, ['kind']);
      out.hours = { kind: 'any' };
    } else throw new RangeError(`${f}.kind must be daylight, clock or any`);
  }
  if (raw.weekendBans !== undefined) {
    if (!Array.isArray(raw.weekendBans) || raw.weekendBans.length > 14) throw new RangeError(`${field}.weekendBans must be a list of at most 14 bans`);
    out.weekendBans = raw.weekendBans.map((b, i) => {
      const f = `${field}.weekendBans[${i}]`;
      if (!isObject(b)) throw new RangeError(`${f} must be an object with day, from, to`);
      onlyKeys(f, b, ['day', 'from', 'to']);
      const ban: WeekendBan = { day: days(`${f}.day`, b.day) };
      if (b.from !== undefined) ban.from = clock(`${f}.from`, b.from);
      if (b.to !== undefined) ban.to = clock(`${f}.to`, b.to, true);
      if (ban.from && ban.to && ban.to <= ban.from) throw new RangeError(`${f}.to must be after ${f}.from`);
      return ban;
    });
  }
  if (raw.holidays !== undefined) {
    const h = raw.holidays;
    const f = `${field}.holidays`;
    if (!isObject(h)) throw new RangeError(`${f} must be an object with names, from, observance`);
    onlyKeys(f, h, ['names', 'from', 'observance', 'until']);
    if (!Array.isArray(h.names)) throw new RangeError(`${f}.names must be a list of holidays (${Object.keys(HOLIDAY_NAMES).join(', ')})`);
    const names = h.names.map((n, i) => {
      if (typeof n !== 'string' || !(n in HOLIDAY_NAMES)) throw new RangeError(`${f}.names[${i}] must be one of ${Object.keys(HOLIDAY_NAMES).join(', ')}`);
      return n as HolidayName;
    });
    const from = h.from ?? 'day-only';
    if (!HOLIDAY_FROM.includes(from as HolidayRule['from'])) throw new RangeError(`${f}.from must be one of ${HOLIDAY_FROM.join(', ')}`);
    const observance = h.observance ?? 'actual';
    if (!OBSERVANCE.includes(observance as HolidayRule['observance'])) throw new RangeError(`${f}.observance must be one of ${OBSERVANCE.join(', ')}`);
    out.holidays = { names: [...new Set(names)], from: from as HolidayRule['from'], observance: observance as HolidayRule['observance'] };
    if (h.until !== undefined) out.holidays.until = clock(`${f}.until`, h.until);
  }
  if (raw.curfews !== undefined) {
    if (!Array.isArray(raw.curfews) || raw.curfews.length > 20) throw new RangeError(`${field}.curfews must be a list of at most 20 curfews`);
    out.curfews = raw.curfews.map((c, i) => {
      const f = `${field}.curfews[${i}]`;
      if (!isObject(c)) throw new RangeError(`${f} must be an object with area, start, end, days`);
      onlyKeys(f, c, ['area', 'start', 'end', 'days', 'appliesIn']);
      if (typeof c.area !== 'string' || !c.area.trim() || c.area.length > 120) throw new RangeError(`${f}.area must name the area (1–120 characters)`);
      const curfew: Curfew = { area: c.area.trim(), start: clock(`${f}.start`, c.start), end: clock(`${f}.end`, c.end), appliesIn: c.appliesIn === 'urban' ? 'urban' : 'everywhere' };
      if (c.appliesIn !== undefined && c.appliesIn !== 'urban' && c.appliesIn !== 'everywhere') throw new RangeError(`${f}.appliesIn must be urban or everywhere`);
      if (curfew.start === curfew.end) throw new RangeError(`${f}.end must differ from ${f}.start`);
      if (c.days !== undefined) {
        if (!Array.isArray(c.days) || c.days.length === 0 || c.days.length > 7) throw new RangeError(`${f}.days must list 1 to 7 days`);
        curfew.days = [...new Set(c.days.map((d, k) => days(`${f}.days[${k}]`, d)))];
      }
      return curfew;
    });
  }
  return out;
}

const permitFact = <T>(t: PermitTerms, value: T): KnownFact<T> => ({
  status: 'sourced',
  value,
  citation: t.label,
  url: '',
  edition: `issued ${t.issuedOn}`,
  asOf: t.issuedOn,
  note: 'the issued permit governs; recorded by the permit clerk',
});

/**
 * The travel rules that hold under the permit: each topic the permit states replaces the rulebook's. Clock hours
 * become "any hour" for daylight plus `clockHours` for the travel-window computation.
 */
export function governedTravelRules(rule: TravelRules, t: PermitTerms): { rules: TravelRules; clockHours: { start: string; end: string; source: string } | null } {
  const p = t.travel ?? {};
  const rules: TravelRules = { ...rule };
  let clockHours: { start: string; end: string; source: string } | null = null;
  if (p.hours) {
    if (p.hours.kind === 'daylight') rules.daylight = permitFact<DaylightRule | null>(t, { startOffsetMin: p.hours.startOffsetMin, endOffsetMin: p.hours.endOffsetMin });
    else {
      rules.daylight = permitFact<DaylightRule | null>(t, null);
      if (p.hours.kind === 'clock') clockHours = { start: p.hours.start, end: p.hours.end, source: `${t.label} (issued ${t.issuedOn})` };
    }
  }
  if (p.weekendBans) rules.weekends = permitFact(t, { bans: p.weekendBans });
  if (p.holidays) rules.holidays = permitFact(t, { ...p.holidays });
  if (p.curfews) rules.curfews = permitFact(t, p.curfews);
  return { rules, clockHours };
}

const describeHours = (h: PermitTravelHours): string =>
  h.kind === 'any' ? 'any hour' : h.kind === 'clock' ? `${h.start}–${h.end} local time` : describeDaylight({ startOffsetMin: h.startOffsetMin, endOffsetMin: h.endOffsetMin });

function ruleWords<T>(f: Fact<T>, describe: (v: T) => string): string {
  return isKnown(f) ? describe(f.value) : 'not on file';
}

const describeCurfews = (list: Curfew[]): string =>
  list.length ? list.map((c) => `${c.area} ${c.start}–${c.end}${c.appliesIn === 'urban' ? ' (urban)' : ''}`).join(', ') : 'none';

/**
 * The topics the permit decides and where it differs from the rulebook (or the rulebook had nothing), e.g.
 * "travel hours — permit: sunrise to sunset; rulebook: not on file", "escorts — permit asks 2 front, 1 rear;
 * rulebook: 1 front, 1 rear".
 */
export function permitGovernance(
  rule: TravelRules,
  t: PermitTerms,
  rulebookEscorts: { front: number; rear: number; known: boolean },
): PermitGovernance {
  const p = t.travel ?? {};
  const topics: string[] = [];
  const differences: string[] = [];
  const compare = (topic: string, label: string, permit: string, rulebook: string): void => {
    topics.push(topic);
    if (permit !== rulebook) differences.push(`${label} — permit: ${permit}; rulebook: ${rulebook}`);
  };
  if (p.hours) compare('travel.hours', 'travel hours', describeHours(p.hours), ruleWords(rule.daylight, (v) => (v ? describeDaylight(v) : 'any hour')));
  if (p.weekendBans) compare('travel.weekends', 'weekends', describeWeekends({ bans: p.weekendBans }), ruleWords(rule.weekends, describeWeekends));
  if (p.holidays) compare('travel.holidays', 'holidays', describeHolidays(p.holidays), ruleWords(rule.holidays, describeHolidays));
  if (p.curfews) compare('travel.curfews', 'curfews', describeCurfews(p.curfews), ruleWords(rule.curfews, describeCurfews));
  if (t.escorts) {
    const permit = `${t.escorts.front} front, ${t.escorts.rear} rear`;
    const rulebook = rulebookEscorts.known ? `${rulebookEscorts.front} front, ${rulebookEscorts.rear} rear` : 'not on file';
    topics.push('escorts');
    if (permit !== rulebook) differences.push(`escorts — permit asks ${permit}; rulebook: ${rulebook}`);
  }
  return { label: t.label, topics, differences };
}

/** One planned travel window of a day that the permit's validity does not cover. */
export type ValidityGap = { date: string; window: string; message: string };

/**
 * A travel day in a state is covered when every travel window planned for that day there lies inside the permit's
 * validity, to the minute ("valid to 23:59" holds through that minute). Where the day's travel hours are not on
 * file the planned window is the whole day, which says nothing of when the permit lets the load move: such a day is
 * covered when the validity reaches into it, and the permit's own hours govern. Returns each window not covered,
 * in words. `local` turns an instant into local date and time with its zone.
 */
export function validityGaps(days: readonly TravelWindowsResult[], validFrom: Date, validTo: Date, local: (d: Date) => string): ValidityGap[] {
  const out: ValidityGap[] = [];
  const from = validFrom.getTime();
  const to = validTo.getTime() + 60_000;
  const range = `${local(validFrom)} to ${local(validTo)}`;
  for (const d of days) {
    const hoursUnknown = d.unknownTopics.includes('daylight');
    const spans = d.intervals.map((iv) => ({ a: Date.parse(iv.start), b: Date.parse(iv.end), window: `${d.date} ${iv.startLocal}–${iv.endLocal} ${d.timeZone}` }));
    if (hoursUnknown) {
      if (spans.length && !spans.some((x) => x.a < to && x.b > from)) {
        out.push({ date: d.date, window: `${d.date} ${d.timeZone}`, message: `travel day ${d.date} lies outside the permit's validity (${range}); travel hours not on file` });
      }
      continue;
    }
    for (const x of spans) {
      if (x.a >= to || x.b <= from) out.push({ date: d.date, window: x.window, message: `travel window ${x.window} lies outside the permit's validity (${range})` });
      else if (x.a < from) out.push({ date: d.date, window: x.window, message: `travel window ${x.window} starts before the permit is valid (from ${local(validFrom)})` });
      else if (x.b > to) out.push({ date: d.date, window: x.window, message: `travel window ${x.window} ends after the permit expires (${local(validTo)})` });
    }
  }
  return out;
}
