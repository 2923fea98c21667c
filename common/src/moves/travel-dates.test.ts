import { travelDates } from './travel-dates';

describe('travelDates', () => {
  // Calendar arithmetic, common practice, no published source: a move planned for N travel days runs on the
  // departure date and the N − 1 dates after it.
  it.each([
    ['one day is the departure date', '2026-03-10', 1, ['2026-03-10']],
    ['three days run on consecutive dates', '2026-03-10', 3, ['2026-03-10', '2026-03-11', '2026-03-12']],
    ['across a month end', '2026-01-30', 3, ['2026-01-30', '2026-01-31', '2026-02-01']],
    ['across a year end', '2026-12-31', 2, ['2026-12-31', '2027-01-01']],
    // Gregorian leap-year rule (divisible by 4, not by 100 unless by 400): 2028 has a 29 February
    ['through 29 February of a leap year', '2028-02-28', 3, ['2028-02-28', '2028-02-29', '2028-03-01']],
    // US daylight saving time began on 8 March 2026 (Energy Policy Act of 2005, 15 U.S.C. 260a): dates do not shift
    ['over the start of daylight saving time', '2026-03-07', 3, ['2026-03-07', '2026-03-08', '2026-03-09']],
    ['no travel days gives no dates', '2026-03-10', 0, []],
  ])('%s', (_name, departure, days, expected) => {
    expect(travelDates(departure, days)).toEqual(expected);
  });
});
