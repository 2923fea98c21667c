import { calendarDate, localInstant, zonedDateTime, zonedRange } from './time';

describe('zonedDateTime names the zone and reads the clock there', () => {
  it.each([
    // winter: Central Standard Time is UTC−6
    ['2026-12-10T06:01:00Z', 'America/Chicago', '2026-12-10 00:01 CST'],
    // summer: Central Daylight Time is UTC−5
    ['2026-07-04T17:30:00Z', 'America/Chicago', '2026-07-04 12:30 CDT'],
    // Arizona keeps standard time all year
    ['2026-07-04T17:30:00Z', 'America/Phoenix', '2026-07-04 10:30 MST'],
    // the instant crosses midnight into the previous day in the zone
    ['2027-01-01T03:00:00Z', 'America/Los_Angeles', '2026-12-31 19:00 PST'],
    // the spring change, 2026-03-08 at 02:00 local: 07:00Z in New York, 08:00Z in Chicago
    ['2026-03-08T07:30:00Z', 'America/New_York', '2026-03-08 03:30 EDT'],
    ['2026-03-08T08:30:00Z', 'America/Chicago', '2026-03-08 03:30 CDT'],
  ])('%s in %s', (iso, zone, expected) => {
    expect(zonedDateTime(iso, zone)).toBe(expected);
  });

  it('shows a dash for nothing and gives back what does not read as an instant', () => {
    expect(zonedDateTime(null, 'America/Chicago')).toBe('—');
    expect(zonedDateTime('not a date', 'America/Chicago')).toBe('not a date');
  });

  it('writes a validity window in one zone, or a dash when an end is missing', () => {
    expect(zonedRange('2026-12-10T06:01:00Z', '2026-12-14T05:59:00Z', 'America/Chicago')).toBe('2026-12-10 00:01 CST – 2026-12-13 23:59 CST');
    expect(zonedRange('2026-12-10T06:01:00Z', null, 'America/Chicago')).toBe('—');
  });
});

describe('localInstant', () => {
  it('reads the instant in the given zone with its name', () => {
    expect(localInstant('2027-01-12T13:14:00Z', 'America/Chicago')).toBe('Tue, Jan 12, 07:14 CST');
  });

  it('falls back to UTC for a zone the browser does not know', () => {
    expect(localInstant('2027-01-12T13:14:00Z', 'Not/AZone')).toBe('2027-01-12 13:14 UTC');
  });

  it('shows a dash for nothing', () => {
    expect(localInstant(undefined)).toBe('—');
  });
});

describe('calendarDate', () => {
  it.each([
    ['2027-01-12', 'Tue, Jan 12, 2027'],
    // a date stays the same date whatever the viewer's zone
    ['2026-03-08', 'Sun, Mar 8, 2026'],
    ['2026-12-31T23:00:00Z', 'Thu, Dec 31, 2026'],
  ])('%s', (date, expected) => {
    expect(calendarDate(date)).toBe(expected);
  });

  it('gives back what is not a date and a dash for nothing', () => {
    expect(calendarDate('soon')).toBe('soon');
    expect(calendarDate(null)).toBe('—');
  });
});
