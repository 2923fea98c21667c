import { sunTimes } from './sun-times';

const minutesBetween = (iso: string, expectedUtc: string) => Math.abs(Date.parse(iso) - Date.parse(expectedUtc)) / 60_000;

describe('sunTimes (suncalc; sun 50′ below the horizon)', () => {
  // USNO tables, references §5. Local times converted to UTC with the offsets given there. Tolerance ±3 min.
  it.each([
    ['USNO: Atlanta 2009-09-06 sunrise 07:15 UTC−4', '2009-09-06', 33.8, -84.4, 'sunrise', '2009-09-06T11:15:00Z'],
    ['USNO: Atlanta 2009-09-06 sunset 19:56 UTC−4', '2009-09-06', 33.8, -84.4, 'sunset', '2009-09-06T23:56:00Z'],
    ['USNO: Washington DC 2002-03-20 sunrise 06:12 UTC−5', '2002-03-20', 38.9, -77.0, 'sunrise', '2002-03-20T11:12:00Z'],
    ['USNO: Washington DC 2002-03-20 sunset 18:21 UTC−5', '2002-03-20', 38.9, -77.0, 'sunset', '2002-03-20T23:21:00Z'],
  ] as const)('%s (±3 min)', (_name, date, lat, lon, which, expected) => {
    const t = sunTimes(date, lat, lon);
    expect(minutesBetween(t[which]!, expected)).toBeLessThanOrEqual(3);
  });

  it('returns the local calendar day, not the UTC one (evening sunset in the western US falls on the next UTC date)', () => {
    const t = sunTimes('2024-06-21', 47.6, -122.3); // Seattle
    expect(t.sunset!.startsWith('2024-06-22T0')).toBe(true);
    expect(t.sunrise!.startsWith('2024-06-21T1')).toBe(true);
  });

  it('polar night: no sunrise or sunset, flagged', () => {
    const t = sunTimes('2024-12-21', 71.3, -156.8);
    expect(t.sunrise).toBeNull();
    expect(t.alwaysDown).toBe(true);
  });

  it.each([
    ['2024-02-30', 30, -90, /real calendar date/],
    ['2024/01/01', 30, -90, /YYYY-MM-DD/],
    ['2024-01-01', 95, -90, /lat must be at most 90/],
    ['2024-01-01', 30, Number.NaN, /lon must be a finite number/],
  ])('bad input %s, %p, %p → RangeError', (date, lat, lon, msg) => {
    expect(() => sunTimes(date, lat, lon)).toThrow(RangeError);
    expect(() => sunTimes(date, lat, lon)).toThrow(msg);
  });
});
