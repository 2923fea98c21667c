import { fixtureRule, known, openTravel, unknown } from './__fixtures__/facts';
import type { TravelRules } from './jurisdiction-rule';
import { checkPermitTravelTerms, governedTravelRules, permitGovernance, validityGaps, type PermitTerms } from './permit-terms';
import { planCheck } from './plan-check';
import { SAMPLE_PLAN } from './sample-plan';
import { travelWindows } from './travel-windows';
import { localClock, localDate } from './time-zone';

// Sunrise and sunset for Atlanta (33.8 N, 84.4 W) on 2009-09-06: 07:15 and 19:56 EDT, U.S. Naval Observatory,
// "Sun and Moon Data for One Day" (the same reference the travel-window tests use).
const ATL = { lat: 33.8, lon: -84.4, timeZone: 'America/New_York' };
const minutes = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3));
const NOTHING_ON_FILE: TravelRules = { daylight: unknown(), weekends: unknown(), holidays: unknown(), curfews: unknown(), minVisibilityFt: unknown() };
const permit = (travel: PermitTerms['travel'], extra: Partial<PermitTerms> = {}): PermitTerms => ({ label: 'GA permit 26-0417', issuedOn: '2009-09-01', travel, ...extra });
const local = (d: Date) => `${localDate(d.getTime(), ATL.timeZone)} ${localClock(d.getTime(), ATL.timeZone)}`;

describe('checkPermitTravelTerms', () => {
  it('keeps what a clerk records and refuses an unknown topic by name', () => {
    expect(checkPermitTravelTerms({ hours: { kind: 'daylight', startOffsetMin: -30, endOffsetMin: 30 }, weekendBans: [] })).toEqual({
      hours: { kind: 'daylight', startOffsetMin: -30, endOffsetMin: 30 },
      weekendBans: [],
    });
    expect(() => checkPermitTravelTerms({ nightHours: true })).toThrow(/^travel\.nightHours is not a permit condition/);
    expect(() => checkPermitTravelTerms({ hours: { kind: 'clock', start: '19:00', end: '07:00' } })).toThrow(/^travel\.hours\.end must be after/);
    expect(() => checkPermitTravelTerms({ hours: { kind: 'clock', start: '7:00', end: '19:00' } })).toThrow(/^travel\.hours\.start must be a local time HH:MM/);
    expect(() => checkPermitTravelTerms({ holidays: { names: ['boxing-day'] } })).toThrow(/^travel\.holidays\.names\[0\] must be one of/);
    expect(() => checkPermitTravelTerms({ weekendBans: [{ day: 7 }] })).toThrow(/^travel\.weekendBans\[0\]\.day must be a day 0/);
    expect(() => checkPermitTravelTerms({ curfews: [{ area: '', start: '07:00', end: '09:00' }] })).toThrow(/^travel\.curfews\[0\]\.area/);
  });
});

describe('the permit governs the travel windows', () => {
  it('a permit reading "sunrise to sunset" makes a day known where the rulebook had nothing: 07:15–19:56 (USNO, ±3 min)', () => {
    const before = travelWindows({ date: '2009-09-06', ...ATL, rule: NOTHING_ON_FILE });
    expect(before.known).toBe(false);
    const g = governedTravelRules(NOTHING_ON_FILE, permit({ hours: { kind: 'daylight', startOffsetMin: 0, endOffsetMin: 0 }, weekendBans: [], holidays: { names: [], from: 'day-only', observance: 'actual' }, curfews: [] }));
    const r = travelWindows({ date: '2009-09-06', ...ATL, rule: g.rules });
    expect(r.known).toBe(true);
    expect(r.intervals).toHaveLength(1);
    expect(Math.abs(minutes(r.intervals[0].startLocal) - minutes('07:15'))).toBeLessThanOrEqual(3);
    expect(Math.abs(minutes(r.intervals[0].endLocal) - minutes('19:56'))).toBeLessThanOrEqual(3);
    // the source shown is the permit, not the rulebook
    expect(r.restrictions.find((x) => x.code === 'daylight')?.source).toMatch(/GA permit 26-0417/);
  });

  it('fixed clock hours on the permit give exactly that window, whatever the rulebook says of daylight', () => {
    const rulebook = { ...openTravel(), daylight: known({ startOffsetMin: -30, endOffsetMin: 30 }, 'state rule') };
    const g = governedTravelRules(rulebook, permit({ hours: { kind: 'clock', start: '09:00', end: '15:30' } }));
    const r = travelWindows({ date: '2009-09-06', ...ATL, rule: g.rules, ...(g.clockHours ? { clockHours: g.clockHours } : {}) });
    expect(r.intervals.map((i) => `${i.startLocal}–${i.endLocal}`)).toEqual(['09:00–15:30']);
    expect(r.restrictions.find((x) => x.code === 'permit-hours')?.source).toMatch(/GA permit 26-0417/);
  });

  it('lists each topic the permit decides and where it differs from the rulebook or fills a gap', () => {
    const rulebook = { ...NOTHING_ON_FILE, weekends: known({ bans: [] }, 'state rule') };
    const g = permitGovernance(rulebook, permit({ hours: { kind: 'daylight', startOffsetMin: 0, endOffsetMin: 0 }, weekendBans: [] }, { escorts: { front: 2, rear: 1 } }), { front: 1, rear: 1, known: true });
    expect(g.topics).toEqual(['travel.hours', 'travel.weekends', 'escorts']);
    expect(g.differences).toEqual(['travel hours — permit: sunrise to sunset; rulebook: not on file', 'escorts — permit asks 2 front, 1 rear; rulebook: 1 front, 1 rear']);
  });
});

describe('validityGaps: a travel day is covered when every window planned for it lies inside the validity, to the minute', () => {
  const day = travelWindows({ date: '2009-09-06', ...ATL, rule: { ...openTravel(), daylight: known({ startOffsetMin: 0, endOffsetMin: 0 }) } });
  const at = (hhmm: string, date = '2009-09-06') => new Date(`${date}T${hhmm}:00-04:00`);

  it('a permit valid 00:01 to 23:59 covers a sunrise-to-sunset day', () => {
    expect(validityGaps([day], at('00:01'), at('23:59'), local)).toEqual([]);
  });

  it('a permit valid from 08:00 does not cover a window that opens at sunrise, and says which', () => {
    const gaps = validityGaps([day], at('08:00'), at('23:59'), local);
    expect(gaps).toHaveLength(1);
    expect(gaps[0].date).toBe('2009-09-06');
    expect(gaps[0].message).toMatch(/^travel window 2009-09-06 07:1\d–19:5\d America\/New_York starts before the permit is valid \(from 2009-09-06 08:00\)$/);
  });

  it('where travel hours are not on file, a day is covered when the validity reaches into it (a 00:01 start is not refused)', () => {
    const unknownHours = travelWindows({ date: '2009-09-06', ...ATL, rule: { ...openTravel(), daylight: unknown() } });
    expect(unknownHours.unknownTopics).toContain('daylight');
    expect(validityGaps([unknownHours], at('00:01'), at('23:59'), local)).toEqual([]);
    const later = travelWindows({ date: '2009-09-07', ...ATL, rule: { ...openTravel(), daylight: unknown() } });
    expect(validityGaps([unknownHours, later], at('00:01'), at('23:59'), local).map((g) => g.message)).toEqual([
      'travel day 2009-09-07 lies outside the permit\'s validity (2009-09-06 00:01 to 2009-09-06 23:59); travel hours not on file',
    ]);
  });

  it('a permit valid to 23:59 covers a window open to midnight (valid through its last minute)', () => {
    const allDay = travelWindows({ date: '2009-09-06', ...ATL, rule: openTravel() });
    expect(validityGaps([allDay], at('00:00'), at('23:59'), local)).toEqual([]);
    expect(validityGaps([allDay], at('00:00'), at('23:58'), local)[0].message).toMatch(/ends after the permit expires \(2009-09-06 23:58\)/);
  });
});

describe('planCheck with an issued permit', () => {
  it('the permit’s escorts and hours replace a rulebook with nothing on file, and its open questions close', () => {
    const ga = fixtureRule('GA', 'Georgia');
    const plan = { ...SAMPLE_PLAN, rules: [...SAMPLE_PLAN.rules, ga] };
    const without = planCheck(plan).jurisdictions.find((j) => j.code === 'GA')!;
    expect(without.escorts.known).toBe(false);
    expect(without.openQuestions.some((q) => q.topic === 'escorts')).toBe(true);
    expect(without.governedBy).toBeNull();

    const terms = permit({ hours: { kind: 'daylight', startOffsetMin: 0, endOffsetMin: 0 }, weekendBans: [{ day: 0 }], holidays: { names: ['memorial-day'], from: 'day-only', observance: 'actual' }, curfews: [] }, { escorts: { front: 1, rear: 1 } });
    const r = planCheck({ ...plan, permits: { GA: terms } });
    const j = r.jurisdictions.find((x) => x.code === 'GA')!;
    expect(j.escorts).toMatchObject({ known: true, front: 1, rear: 1 });
    expect(j.escorts.reasons[0].source).toMatch(/GA permit 26-0417/);
    expect(j.openQuestions.filter((q) => q.topic === 'escorts' || q.topic.startsWith('travel.daylight'))).toEqual([]);
    expect(r.summary.escortsNotOnFile).not.toContain('GA');
    expect(j.governedBy?.differences).toContain('travel hours — permit: sunrise to sunset; rulebook: not on file');
    // every planned day in GA is now known, and no interval opens before sunrise
    expect(j.travel.every((d) => d.known)).toBe(true);
    for (const d of j.travel) for (const iv of d.intervals) expect(Date.parse(iv.start)).toBeGreaterThanOrEqual(Date.parse(d.sunrise!));
  });
});
