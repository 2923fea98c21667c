import { known, openTravel } from '../engine/__fixtures__/facts';
import { travelWindows } from '../engine/travel-windows';
import { datesByState, dayPlan, defaultDailyMiles, scheduleCheck } from './schedule';

// A Texas–New Mexico run of 180 + 45 mi; arithmetic of the route's own miles (no outside table involved).
const ROUTE = [
  { order: 1, jurisdiction: 'TX', miles: 180 },
  { order: 2, jurisdiction: 'NM', miles: 45 },
];
const ELP = { lat: 31.8, lon: -106.4, timeZone: 'America/Denver' };

describe('dayPlan', () => {
  it('spreads the route over the travel days by default and puts each state on the days it is driven', () => {
    expect(defaultDailyMiles(225, 2)).toBe(113);
    const p = dayPlan(ROUTE, ['2026-12-15', '2026-12-16'], 113);
    expect(p.days.map((d) => d.states)).toEqual([[{ jurisdiction: 'TX', miles: 113 }], [{ jurisdiction: 'TX', miles: 67 }, { jurisdiction: 'NM', miles: 45 }]]);
    expect(datesByState(p)).toEqual({ TX: ['2026-12-15', '2026-12-16'], NM: ['2026-12-16'] });
    expect(p.daysNeeded).toBe(2);
  });

  it('at a longer daily distance the run ends early; at a shorter one it says how many days the route needs', () => {
    const long = dayPlan(ROUTE, ['2026-12-15', '2026-12-16'], 250);
    expect(long.days[1].states).toEqual([]);
    expect(datesByState(long)).toEqual({ TX: ['2026-12-15'], NM: ['2026-12-15'] });
    const short = dayPlan(ROUTE, ['2026-12-15', '2026-12-16'], 100);
    expect(short.daysNeeded).toBe(3);
    // the last planned day takes what is left, so every state still appears
    expect(short.days[1].states).toEqual([{ jurisdiction: 'TX', miles: 80 }, { jurisdiction: 'NM', miles: 45 }]);
    expect(() => dayPlan(ROUTE, ['2026-12-15'], 0)).toThrow(/dailyMiles must be more than 0/);
  });
});

describe('scheduleCheck', () => {
  const daylight = { ...openTravel(), daylight: known({ startOffsetMin: 0, endOffsetMin: 0 }) };
  const sundayBan = { ...daylight, weekends: known({ bans: [{ day: 0 }] }) };
  const windows = (code: string, dates: string[], rule = daylight) => ({ [code]: dates.map((date) => travelWindows({ date, ...ELP, rule })) });

  it('finds a planned day without a legal window, a permit that does not cover a day\'s window, and escorts confirmed for other dates', () => {
    // 2026-12-13 is a Sunday
    const plan = dayPlan(ROUTE, ['2026-12-12', '2026-12-13'], 113);
    const r = scheduleCheck({
      plan,
      travel: { ...windows('TX', ['2026-12-12', '2026-12-13'], sundayBan), ...windows('NM', ['2026-12-12', '2026-12-13']) },
      permitsNeeded: ['TX', 'NM'],
      permits: { NM: { validFrom: '2026-12-13T17:00:00Z', validTo: '2026-12-20T06:59:00Z' } },
      escortSlots: [{ label: 'Lead', jurisdictions: ['NM'] }],
      escorts: [{ label: 'Lead', jurisdictions: ['NM'], startDate: '2026-12-12', endDate: '2026-12-12' }],
      timeZoneOf: () => 'America/Denver',
    });
    expect(r.ok).toBe(false);
    expect(r.findings.map((f) => `${f.code} ${f.jurisdiction} ${f.date}`)).toEqual([
      'no_window TX 2026-12-13',
      'permit_validity NM 2026-12-13',
      'escort_dates NM 2026-12-13',
    ]);
    expect(r.findings[1].message).toMatch(/^NM permit on 2026-12-13: travel window 2026-12-13 0\d:\d\d–17:\d\d America\/Denver starts before the permit is valid \(from 2026-12-13 10:00 MST\)$/);
    expect(r.days[0].findings).toEqual([]);
  });

  it('passes when every state-day has a window, its permit covers it and its escorts are confirmed for it', () => {
    const plan = dayPlan(ROUTE, ['2026-12-15', '2026-12-16'], 113);
    const r = scheduleCheck({
      plan,
      travel: { ...windows('TX', ['2026-12-15', '2026-12-16']), ...windows('NM', ['2026-12-15', '2026-12-16']) },
      permitsNeeded: ['TX', 'NM'],
      permits: { TX: { validFrom: '2026-12-15T06:01:00Z', validTo: '2026-12-17T05:59:00Z' }, NM: { validFrom: '2026-12-16T07:00:00Z', validTo: '2026-12-17T06:59:00Z' } },
      escortSlots: [{ label: 'Lead', jurisdictions: ['TX', 'NM'] }],
      escorts: [{ label: 'Lead', jurisdictions: ['TX', 'NM'], startDate: '2026-12-15', endDate: '2026-12-16' }],
      timeZoneOf: (c) => (c === 'TX' ? 'America/Chicago' : 'America/Denver'),
    });
    expect(r.findings).toEqual([]);
    expect(r.ok).toBe(true);
  });
});
