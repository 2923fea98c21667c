import { known, openTravel, unknown } from './__fixtures__/facts';
import type { Curfew, HolidayName, TravelRules } from './jurisdiction-rule';
import { travelWindows } from './travel-windows';

// Rule shapes as the cited texts word them (the states' own records and their checks live in src/rulebook).
const SIX: HolidayName[] = ['new-years-day', 'memorial-day', 'independence-day', 'labor-day', 'thanksgiving', 'christmas'];
const TX_LIKE: TravelRules = { ...openTravel(), daylight: known({ startOffsetMin: -30, endOffsetMin: 30 }, 'Tex. Transp. Code 541.401 wording') };
const urbanCurfews: Curfew[] = [
  { area: 'cities and towns', start: '07:00', end: '09:00', appliesIn: 'urban', exempt: { overweightOnly: true, overlengthOnlyMaxIn: 85 * 12 } },
  { area: 'cities and towns', start: '16:00', end: '18:00', appliesIn: 'urban', exempt: { overweightOnly: true, overlengthOnlyMaxIn: 85 * 12 } },
];
const VA_LIKE: TravelRules = {
  ...openTravel(),
  daylight: known({ startOffsetMin: 0, endOffsetMin: 0 }, '24VAC20-82-110 wording'),
  holidays: known({ names: SIX, from: 'noon-weekday-before', observance: 'both' }, '24VAC20-82-110 wording'),
  curfews: known(urbanCurfews, '24VAC20-82-110 wording'),
};
const WA_LIKE: TravelRules = {
  ...openTravel(),
  holidays: known({ names: [...SIX, 'day-after-thanksgiving'], from: 'noon-day-before', observance: 'both' }, 'WAC 468-38-175 wording'),
  minVisibilityFt: known(500, 'WAC 468-38-175 wording'),
};
const SAMPLE_RULE_TX = TX_LIKE;
const SAMPLE_RULE_VA = VA_LIKE;
const SAMPLE_RULE_WA = WA_LIKE;

const DC = { lat: 38.9, lon: -77.0, timeZone: 'America/New_York' };
const ATL = { lat: 33.8, lon: -84.4, timeZone: 'America/New_York' };
const minutes = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3));
const open: TravelRules = openTravel();

describe('travelWindows', () => {
  it('Tex. Transp. Code 541.401 + USNO: 30 min before sunrise (07:15) to 30 min after sunset (19:56), Atlanta 2009-09-06, ±3 min', () => {
    const r = travelWindows({ date: '2009-09-06', ...ATL, rule: SAMPLE_RULE_TX });
    expect(r.intervals).toHaveLength(1);
    expect(Math.abs(minutes(r.intervals[0].startLocal) - minutes('06:45'))).toBeLessThanOrEqual(3);
    expect(Math.abs(minutes(r.intervals[0].endLocal) - minutes('20:26'))).toBeLessThanOrEqual(3);
    expect(Date.parse(r.intervals[0].start)).toBe(Date.parse(r.sunrise!) - 30 * 60_000);
    expect(r.restrictions[0].source).toMatch(/541.401/);
  });

  it('24VAC20-82-110 + USNO: sunrise (06:12) to sunset (18:21), Washington DC 2002-03-20, ±3 min', () => {
    const r = travelWindows({ date: '2002-03-20', ...DC, rule: SAMPLE_RULE_VA });
    expect(Math.abs(minutes(r.intervals[0].startLocal) - minutes('06:12'))).toBeLessThanOrEqual(3);
    expect(Math.abs(minutes(r.intervals[0].endLocal) - minutes('18:21'))).toBeLessThanOrEqual(3);
  });

  // 24VAC20-82-110: no travel from noon the preceding weekday through the holiday (Monday holiday: from noon Friday).
  it.each([
    ['2024-05-24', 'Friday before Memorial Day: travel ends at noon', true, '12:00'],
    ['2024-05-25', 'Saturday: blocked', false, null],
    ['2024-05-26', 'Sunday: blocked', false, null],
    ['2024-05-27', 'Memorial Day: blocked', false, null],
    ['2024-07-03', 'Wednesday before Independence Day (Thursday): ends at noon', true, '12:00'],
    ['2024-07-04', 'Independence Day: blocked', false, null],
    ['2024-11-27', 'Wednesday before Thanksgiving: ends at noon', true, '12:00'],
    ['2024-11-29', 'Friday after Thanksgiving: open in Virginia', true, null],
    ['2022-12-23', 'Christmas on Sunday 2022: from noon Friday', true, '12:00'],
    ['2022-12-26', 'Christmas observed Monday 2022: blocked', false, null],
    ['2024-12-31', "New Year's Eve 2024 (Tuesday): ends at noon", true, '12:00'],
  ])('24VAC20-82-110: %s — %s', (date, _what, allowed, endsAt) => {
    const r = travelWindows({ date, ...DC, rule: SAMPLE_RULE_VA });
    expect(r.allowed).toBe(allowed);
    if (endsAt) expect(r.intervals[r.intervals.length - 1].endLocal).toBe(endsAt);
    if (!allowed) expect(r.restrictions.some((x) => x.code === 'holiday' && x.source.includes('24VAC20-82-110'))).toBe(true);
  });

  // WAC 468-38-175: the six holidays plus the day after Thanksgiving, from noon the day before.
  it.each([
    ['2024-11-27', true, '12:00'],
    ['2024-11-28', false, null],
    ['2024-11-29', false, null],
    ['2024-11-30', true, null],
    ['2024-08-30', true, null], // Friday before Labor Day: open (restriction starts noon Sunday)
    ['2024-09-01', true, '12:00'],
  ])('WAC 468-38-175: %s allowed %p (ends %p)', (date, allowed, endsAt) => {
    const r = travelWindows({ date, lat: 47.6, lon: -122.3, timeZone: 'America/Los_Angeles', rule: SAMPLE_RULE_WA });
    expect(r.allowed).toBe(allowed);
    if (endsAt) expect(r.intervals[r.intervals.length - 1].endLocal).toBe(endsAt);
    expect(r.reasons.some((x) => x.code === 'visibility' && x.value === 500)).toBe(true);
  });

  it('24VAC20-82-110: inside city limits no travel 7–9 a.m. and 4–6 p.m.', () => {
    const r = travelWindows({ date: '2024-06-05', ...DC, rule: SAMPLE_RULE_VA, urban: true });
    expect(r.intervals.map((i) => [i.startLocal, i.endLocal])).toEqual([
      [r.intervals[0].startLocal, '07:00'],
      ['09:00', '16:00'],
      ['18:00', r.intervals[2].endLocal],
    ]);
  });

  it.each([
    [{ overweightOnly: true }, 1, '24VAC20-82-110: overweight-only is exempt from the curfew'],
    [{ overlengthOnly: true, lengthIn: 85 * 12 }, 1, '24VAC20-82-110: overlength-only up to 85 ft is exempt'],
    [{ overlengthOnly: true, lengthIn: 85 * 12 + 1 }, 3, '24VAC20-82-110: overlength over 85 ft is not exempt'],
  ])('%j → %i interval(s) (%s)', (load, n, _source) => {
    const r = travelWindows({ date: '2024-06-05', ...DC, rule: SAMPLE_RULE_VA, urban: true, load });
    expect(r.intervals).toHaveLength(n);
  });

  it('not on file is never "open": a record without travel hours says known=false and names the topic', () => {
    const rule: TravelRules = { ...open, daylight: unknown() };
    const r = travelWindows({ date: '2024-06-05', ...DC, rule });
    expect(r.known).toBe(false);
    expect(r.unknownTopics).toEqual(['daylight']);
    expect(r.restrictions.some((x) => x.code === 'not-on-file-daylight' && /not on file/.test(x.message))).toBe(true);
    expect(travelWindows({ date: '2024-06-05', ...DC, rule: open }).known).toBe(true);
  });

  it('weekend limits not on file matter only on a weekend; urban curfews not on file only on an urban segment', () => {
    const rule: TravelRules = { ...open, weekends: unknown(), curfews: unknown() };
    expect(travelWindows({ date: '2024-06-05', ...DC, rule }).known).toBe(true);
    expect(travelWindows({ date: '2024-06-08', ...DC, rule }).unknownTopics).toEqual(['weekends']);
    expect(travelWindows({ date: '2024-06-05', ...DC, rule, urban: true }).unknownTopics).toEqual(['curfews']);
  });

  it('Saturday-after-noon ban: travel until 12:00 on Saturday, none on Sunday', () => {
    const rule: TravelRules = { ...open, weekends: known({ bans: [{ day: 6, from: '12:00' }, { day: 0 }] }) };
    const sat = travelWindows({ date: '2024-06-08', ...DC, rule });
    expect(sat.intervals.map((i) => [i.startLocal, i.endLocal])).toEqual([['00:00', '12:00']]);
    expect(travelWindows({ date: '2024-06-09', ...DC, rule }).allowed).toBe(false);
  });

  it('night travel allowed below the stated width: the daylight rule applies only above it', () => {
    const rule: TravelRules = { ...open, daylight: known({ startOffsetMin: -30, endOffsetMin: 30, appliesAbove: { widthOverIn: 120 } }) };
    expect(travelWindows({ date: '2024-06-05', ...DC, rule, load: { widthIn: 120 } }).intervals[0].startLocal).toBe('00:00');
    expect(travelWindows({ date: '2024-06-05', ...DC, rule, load: { widthIn: 121 } }).intervals[0].startLocal).not.toBe('00:00');
  });

  it('a curfew that crosses midnight (22:00–05:00) takes the evening and the next morning', () => {
    const rule: TravelRules = { ...open, curfews: known([{ area: 'test county', start: '22:00', end: '05:00', appliesIn: 'everywhere' }]) };
    const r = travelWindows({ date: '2024-06-05', ...DC, rule });
    expect(r.intervals.map((i) => [i.startLocal, i.endLocal])).toEqual([['05:00', '22:00']]);
  });

  it('weekend rule: no travel on Saturday when the rule forbids weekends (rulebook data)', () => {
    const rule: TravelRules = { ...open, weekends: known({ bans: [{ day: 6 }, { day: 0 }] }) };
    expect(travelWindows({ date: '2024-06-08', ...DC, rule }).allowed).toBe(false);
    expect(travelWindows({ date: '2024-06-07', ...DC, rule }).allowed).toBe(true);
  });

  it('permit validity clips the days', () => {
    const permitValidity = { from: '2024-06-03', to: '2024-06-07' };
    expect(travelWindows({ date: '2024-06-07', ...DC, rule: open, permitValidity }).allowed).toBe(true);
    expect(travelWindows({ date: '2024-06-08', ...DC, rule: open, permitValidity }).allowed).toBe(false);
  });

  // 15 U.S.C. 260a: DST from the second Sunday of March to the first Sunday of November, 2 a.m.
  it.each([
    ['2024-03-10', 23],
    ['2024-11-03', 25],
    ['2024-06-05', 24],
  ])('15 U.S.C. 260a: %s in New York is %i hours long (local midnight to midnight)', (date, hours) => {
    const r = travelWindows({ date, ...DC, rule: open });
    expect(r.intervals).toHaveLength(1);
    expect((Date.parse(r.intervals[0].end) - Date.parse(r.intervals[0].start)) / 3_600_000).toBe(hours);
    expect(r.intervals[0].startLocal).toBe('00:00');
    expect(r.intervals[0].endLocal).toBe('24:00');
  });

  it('15 U.S.C. 260a: a 7:00 curfew on the spring-forward day is at 7:00 EDT (11:00 UTC)', () => {
    const rule: TravelRules = { ...open, curfews: known([{ area: 'everywhere', start: '07:00', end: '09:00', appliesIn: 'everywhere' }]) };
    const r = travelWindows({ date: '2024-03-10', ...DC, rule });
    expect(r.intervals[0].end).toBe('2024-03-10T11:00:00.000Z');
  });

  it.each([
    [{ date: '2024-13-01' }, /date/],
    [{ timeZone: 'Mars/Olympus' }, /timeZone must be an IANA time zone/],
    [{ lat: -91 }, /lat must be at least -90/],
  ])('bad input %j → RangeError', (patch, msg) => {
    expect(() => travelWindows({ date: '2024-06-05', ...DC, rule: open, ...patch })).toThrow(RangeError);
    expect(() => travelWindows({ date: '2024-06-05', ...DC, rule: open, ...patch })).toThrow(msg);
  });
});

describe('travelWindows: a curfew that crosses midnight (22:00–05:00)', () => {
  // Rule shape as the rulebook words it: "an end before the start crosses midnight" (jurisdiction-rule.ts); the part
  // after midnight falls on the next calendar day in the same zone.
  const night = (days?: number[]): TravelRules => ({
    ...open,
    curfews: known([{ area: 'test county', start: '22:00', end: '05:00', appliesIn: 'everywhere', ...(days ? { days } : {}) }], 'curfew wording for the test'),
  });
  const allowedAt = (r: ReturnType<typeof travelWindows>, hhmm: string): boolean =>
    r.intervals.some((i) => minutes(i.startLocal) <= minutes(hhmm) && minutes(hhmm) < (i.endLocal === '24:00' ? 24 * 60 : minutes(i.endLocal)));

  it.each([
    ['04:59', false, 'just before the end: still the curfew that began the evening before'],
    ['05:00', true, 'at the end'],
    ['05:01', true, 'just after the end'],
    ['21:59', true, 'just before the start'],
    ['22:00', false, 'at the start'],
    ['22:01', false, 'just after the start'],
    ['23:59', false, 'before midnight'],
    ['00:00', false, 'midnight: the part after midnight of the day before'],
  ] as const)('every day, Wednesday 2024-06-05 at %s: allowed %p (%s)', (hhmm, allowed, _why) => {
    expect(allowedAt(travelWindows({ date: '2024-06-05', ...DC, rule: night() }), hhmm)).toBe(allowed);
  });

  it('a curfew that starts on Fridays only takes Friday evening and Saturday morning, not Friday morning', () => {
    const fri = travelWindows({ date: '2024-06-07', ...DC, rule: night([5]) });
    const sat = travelWindows({ date: '2024-06-08', ...DC, rule: night([5]) });
    expect(fri.intervals.map((i) => [i.startLocal, i.endLocal])).toEqual([['00:00', '22:00']]);
    expect(sat.intervals.map((i) => [i.startLocal, i.endLocal])).toEqual([['05:00', '24:00']]);
    expect(allowedAt(sat, '04:59')).toBe(false);
    expect(allowedAt(sat, '05:00')).toBe(true);
    expect(allowedAt(fri, '21:59')).toBe(true);
    expect(allowedAt(fri, '22:00')).toBe(false);
    expect(sat.restrictions.map((x) => x.code)).toEqual(['curfew']);
  });

  it.each([
    // 15 U.S.C. 260a: DST starts 2024-03-10 and ends 2024-11-03 at 2 a.m.; the curfew's ends stay on the wall clock.
    ['2024-03-10', '2024-03-10T09:00:00.000Z', '2024-03-11T02:00:00.000Z'],
    ['2024-11-03', '2024-11-03T10:00:00.000Z', '2024-11-04T03:00:00.000Z'],
  ])('15 U.S.C. 260a, New York %s: travel 05:00–22:00 on the wall clock across the change', (date, start, end) => {
    const r = travelWindows({ date, ...DC, rule: night() });
    expect(r.intervals.map((i) => [i.startLocal, i.endLocal])).toEqual([['05:00', '22:00']]);
    expect(r.intervals[0].start).toBe(start);
    expect(r.intervals[0].end).toBe(end);
  });
});
