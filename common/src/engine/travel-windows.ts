/** Legal travel windows for one day in one jurisdiction. */
import { HOLIDAY_NAMES, holidayDayNumber, observedDayNumber } from './holidays';
import { JurisdictionRule, RoadType, TravelRules, appliesTo, cite, isKnown } from './jurisdiction-rule';
import { NOT_ON_FILE, NOT_ON_FILE_SOURCE, Reason } from './reasons';
import { sunTimesMs, checkLatLon } from './sun-times';
import { checkTimeZone, dayNumberOf, localClock, weekdayOf, zoneOffsetMinutes, zonedTimeToUtc } from './time-zone';
import { parseIsoDate } from './validate';

const MIN = 60_000;

export type TravelLoadFacts = {
  /** Over legal weight only (no dimension over legal). */
  overweightOnly?: boolean;
  /** Over legal length only (no other dimension or weight over legal). */
  overlengthOnly?: boolean;
  widthIn?: number;
  heightIn?: number;
  lengthIn?: number;
  grossLb?: number;
  /** Road class travelled (for the record; night-travel and curfew rules may name it). */
  roadType?: RoadType;
};

export type TravelWindowsInput = {
  date: string;
  lat: number;
  lon: number;
  /** IANA zone of the segment, e.g. America/Chicago. */
  timeZone: string;
  /** A whole rulebook record or just its travel rules. */
  rule: JurisdictionRule | TravelRules;
  /** Inside city or town limits (urban curfews apply). */
  urban?: boolean;
  load?: TravelLoadFacts;
  /** The permit's validity window (inclusive dates). */
  permitValidity?: { from: string; to: string };
  /** Fixed local travel hours an issued permit sets (`HH:MM`, end after start), with the permit as source. */
  clockHours?: { start: string; end: string; source: string };
};

export type TravelInterval = {
  /** UTC instants (ISO). */
  start: string;
  end: string;
  /** Local wall-clock `HH:MM` in the segment's zone. */
  startLocal: string;
  endLocal: string;
};

export type TravelWindowsResult = {
  date: string;
  timeZone: string;
  /**
   * False when a travel topic this day needs (daylight, weekends, holidays, urban curfews) is not on file: the
   * intervals then hold only what the topics on file take away, and must not be read as permission.
   */
  known: boolean;
  /** The travel topics not on file (`daylight`, `weekends`, `holidays`, `curfews`). */
  unknownTopics: string[];
  allowed: boolean;
  intervals: TravelInterval[];
  sunrise: string | null;
  sunset: string | null;
  /** Why time was taken away (weekend, holiday, curfew, outside daylight, permit validity). */
  restrictions: Reason[];
  reasons: Reason[];
};

type Span = [number, number];

function subtract(spans: Span[], cut: Span): Span[] {
  const out: Span[] = [];
  for (const [a, b] of spans) {
    if (cut[1] <= a || cut[0] >= b) {
      out.push([a, b]);
      continue;
    }
    if (cut[0] > a) out.push([a, cut[0]]);
    if (cut[1] < b) out.push([cut[1], b]);
  }
  return out;
}

function parseClock(field: string, hhmm: string): number {
  const m = /^(\d{2}):(\d{2})$/.exec(hhmm);
  const minutes = m ? Number(m[1]) * 60 + Number(m[2]) : NaN;
  if (!m || Number(m[2]) > 59 || minutes > 24 * 60) throw new RangeError(`${field} must be a HH:MM time; got "${hhmm}"`);
  return minutes;
}

const DAY_NAMES = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];

const isTravelRules = (r: JurisdictionRule | TravelRules): r is TravelRules => !('travel' in r);

/**
 * Allowed travel intervals for one local day: daylight with the rule's offsets, weekend rule, holiday list with its
 * start convention (e.g. from noon the weekday before), urban curfews and the permit's validity window.
 */
export function travelWindows(input: TravelWindowsInput): TravelWindowsResult {
  const { y, m, d } = parseIsoDate('date', input.date);
  checkLatLon(input.lat, input.lon);
  const tz = checkTimeZone(input.timeZone);
  const travel = isTravelRules(input.rule) ? input.rule : input.rule.travel;
  const who = isTravelRules(input.rule) ? 'travel rule' : input.rule.name;
  const day = dayNumberOf(y, m, d);
  const dow = weekdayOf(day);
  const restrictions: Reason[] = [];
  const reasons: Reason[] = [];

  const dayStart = zonedTimeToUtc(day, 0, tz);
  const dayEnd = zonedTimeToUtc(day + 1, 0, tz);
  // Within a day with one offset, wall-clock times are plain additions from midnight.
  const steady = zoneOffsetMinutes(tz, dayStart) === zoneOffsetMinutes(tz, dayEnd - 1);
  const at = (dayNum: number, minutes: number): number =>
    dayNum === day && steady ? dayStart + minutes * MIN : zonedTimeToUtc(dayNum, minutes, tz);

  const sun = sunTimesMs(y, m, d, input.lat, input.lon);
  let spans: Span[] = [[dayStart, dayEnd]];

  const load = input.load ?? {};
  const unknownTopics: string[] = [];
  const notOnFile = (topic: string, what: string): void => {
    unknownTopics.push(topic);
    restrictions.push({ code: `not-on-file-${topic}`, message: `${who}: ${what} ${NOT_ON_FILE}`, source: NOT_ON_FILE_SOURCE });
  };
  const dims = { widthIn: load.widthIn, heightIn: load.heightIn, lengthIn: load.lengthIn, grossLb: load.grossLb };

  const daylight = travel.daylight;
  if (!isKnown(daylight)) notOnFile('daylight', 'travel hours');
  else if (daylight.value && appliesTo(daylight.value.appliesAbove, dims)) {
    const dl = daylight.value;
    let from: number;
    let to: number;
    if (sun.sunrise !== null && sun.sunset !== null) {
      from = sun.sunrise + dl.startOffsetMin * MIN;
      to = sun.sunset + dl.endOffsetMin * MIN;
    } else {
      from = sun.alwaysUp ? dayStart : dayEnd;
      to = dayEnd;
    }
    const fmtOff = (o: number, what: string): string => (o === 0 ? what : `${Math.abs(o)} min ${o < 0 ? 'before' : 'after'} ${what}`);
    const msg = `${who}: daylight travel only, ${fmtOff(dl.startOffsetMin, 'sunrise')} to ${fmtOff(dl.endOffsetMin, 'sunset')} (${localClock(
      Math.max(from, dayStart),
      tz,
    )}–${localClock(Math.min(to, dayEnd - 1), tz)})`;
    spans = subtract(subtract(spans, [dayStart, Math.max(dayStart, from)]), [Math.min(to, dayEnd), dayEnd]);
    restrictions.push({ code: 'daylight', message: msg, source: cite(daylight) });
  } else if (daylight.value) {
    reasons.push({ code: 'night-allowed', message: `${who}: this load is under the daylight-only dimensions; travel at any hour`, source: cite(daylight) });
  }

  if (input.clockHours) {
    const a = parseClock('clockHours.start', input.clockHours.start);
    const b = parseClock('clockHours.end', input.clockHours.end);
    if (b <= a) throw new RangeError('clockHours.end must be after clockHours.start');
    spans = subtract(subtract(spans, [dayStart, at(day, a)]), [b >= 24 * 60 ? dayEnd : at(day, b), dayEnd]);
    restrictions.push({ code: 'permit-hours', message: `${who}: travel ${input.clockHours.start}–${input.clockHours.end} local time only`, source: input.clockHours.source });
  }

  const weekends = travel.weekends;
  if (!isKnown(weekends)) {
    if (dow === 0 || dow === 6) notOnFile('weekends', 'weekend travel');
  } else if (appliesTo(weekends.value.appliesAbove, dims)) {
    for (const ban of weekends.value.bans) {
      if (ban.day !== dow) continue;
      const fromMin = ban.from ? parseClock('weekends.from', ban.from) : 0;
      const toMin = ban.to ? parseClock('weekends.to', ban.to) : 24 * 60;
      spans = subtract(spans, [at(day, fromMin), toMin >= 24 * 60 ? dayEnd : at(day, toMin)]);
      const dayName = DAY_NAMES[dow];
      restrictions.push({
        code: 'weekend',
        message: `${who}: no travel on ${dayName}${ban.from || ban.to ? ` ${ban.from ?? '00:00'}–${ban.to ?? '24:00'}` : ''}`,
        source: cite(weekends),
      });
    }
  }

  const holidays = travel.holidays;
  if (!isKnown(holidays)) notOnFile('holidays', 'holiday travel limits');
  else if (holidays.value.names.length > 0 && spans.length > 0 && appliesTo(holidays.value.appliesAbove, dims)) {
    const hol = holidays.value;
    const untilMin = hol.until ? parseClock('holidays.until', hol.until) : 24 * 60;
    const years = m === 12 ? [y, y + 1] : m === 1 ? [y - 1, y] : [y];
    const seen = new Set<string>();
    for (const name of hol.names) {
      for (const yr of years) {
        const actual = holidayDayNumber(name, yr);
        const dates = hol.observance === 'actual' ? [actual] : hol.observance === 'observed' ? [observedDayNumber(actual)] : [actual, observedDayNumber(actual)];
        for (const h of dates) {
          const key = `${name}|${h}`;
          if (h < day || h > day + 5 || seen.has(key)) continue;
          seen.add(key);
          let startDay = h;
          let startMin = 0;
          if (hol.from === 'noon-day-before') {
            startDay = h - 1;
            startMin = 12 * 60;
          } else if (hol.from === 'noon-weekday-before') {
            startDay = h - 1;
            while (weekdayOf(startDay) === 0 || weekdayOf(startDay) === 6) startDay -= 1;
            startMin = 12 * 60;
          }
          if (day < startDay || day > h) continue;
          const cut: Span = [at(startDay, startMin), untilMin >= 24 * 60 ? at(h + 1, 0) : at(h, untilMin)];
          spans = subtract(spans, cut);
          const label = `${HOLIDAY_NAMES[name]}${h !== actual ? ' (observed)' : ''}`;
          const when =
            hol.from === 'day-only'
              ? 'the holiday itself'
              : `from noon ${hol.from === 'noon-weekday-before' ? 'the weekday' : 'the day'} before through the holiday`;
          restrictions.push({ code: 'holiday', message: `${who}: no travel for ${label}, ${when}${hol.until ? ` until ${hol.until}` : ''}`, source: cite(holidays) });
        }
      }
    }
  }

  const curfews = travel.curfews;
  if (!isKnown(curfews)) {
    if (input.urban) notOnFile('curfews', 'urban curfews');
  } else {
    for (const c of curfews.value) {
      if (spans.length === 0) break;
      if (c.appliesIn === 'urban' && !input.urban) continue;
      if (!appliesTo(c.appliesAbove, dims)) continue;
      if (c.exempt?.overweightOnly && load.overweightOnly) {
        reasons.push({ code: 'curfew-exempt', message: `${who}: ${c.area} curfew ${c.start}–${c.end} does not apply to an overweight-only load`, source: cite(curfews) });
        continue;
      }
      if (c.exempt?.overlengthOnlyMaxIn !== undefined && load.overlengthOnly && (load.lengthIn ?? Infinity) <= c.exempt.overlengthOnlyMaxIn) {
        reasons.push({ code: 'curfew-exempt', message: `${who}: ${c.area} curfew ${c.start}–${c.end} does not apply to an overlength-only load of this length`, source: cite(curfews) });
        continue;
      }
      const a = parseClock('curfew.start', c.start);
      const b = parseClock('curfew.end', c.end);
      const cuts: Span[] = [];
      // a curfew that starts on this day, and the tail of one that started the day before and crosses midnight
      if (!c.days || c.days.includes(dow)) cuts.push([at(day, a), b > a ? at(day, b) : dayEnd]);
      if (b < a && (!c.days || c.days.includes((dow + 6) % 7))) cuts.push([dayStart, at(day, b)]);
      if (cuts.length === 0) continue;
      for (const cut of cuts) spans = subtract(spans, cut);
      restrictions.push({ code: 'curfew', message: `${who}: ${c.area} ${c.appliesIn === 'urban' ? 'urban ' : ''}curfew, no travel ${c.start}–${c.end}`, source: cite(curfews) });
    }
  }

  if (input.permitValidity) {
    const from = parseIsoDate('permitValidity.from', input.permitValidity.from);
    const to = parseIsoDate('permitValidity.to', input.permitValidity.to);
    const fromDay = dayNumberOf(from.y, from.m, from.d);
    const toDay = dayNumberOf(to.y, to.m, to.d);
    if (toDay < fromDay) throw new RangeError('permitValidity.to must not be before permitValidity.from');
    if (day < fromDay || day > toDay) {
      spans = [];
      restrictions.push({ code: 'permit-validity', message: `outside the permit's validity (${input.permitValidity.from} to ${input.permitValidity.to})`, source: 'issued permit' });
    }
  }

  const vis = travel.minVisibilityFt;
  if (isKnown(vis) && vis.value !== null) {
    reasons.push({ code: 'visibility', message: `${who}: no movement when visibility is reduced to ${vis.value} ft`, value: vis.value, unit: 'ft', source: cite(vis) });
  }

  const intervals: TravelInterval[] = spans
    .filter(([a, b]) => b - a >= MIN)
    .map(([a, b]) => ({
      start: new Date(a).toISOString(),
      end: new Date(b).toISOString(),
      startLocal: localClock(a, tz),
      endLocal: b === dayEnd ? '24:00' : localClock(b, tz),
    }));
  return {
    date: input.date,
    timeZone: tz,
    known: unknownTopics.length === 0,
    unknownTopics,
    allowed: intervals.length > 0,
    intervals,
    sunrise: sun.sunrise === null ? null : new Date(sun.sunrise).toISOString(),
    sunset: sun.sunset === null ? null : new Date(sun.sunset).toISOString(),
    restrictions,
    reasons: [...restrictions, ...reasons],
  };
}
