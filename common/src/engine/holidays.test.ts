import { observedFederalHolidays } from './holidays';

describe('observedFederalHolidays (5 U.S.C. 6103)', () => {
  it('OPM 2023 list: matches all eleven observed dates', () => {
    expect(observedFederalHolidays(2023).map((h) => h.date)).toEqual([
      '2023-01-02',
      '2023-01-16',
      '2023-02-20',
      '2023-05-29',
      '2023-06-19',
      '2023-07-04',
      '2023-09-04',
      '2023-10-09',
      '2023-11-10',
      '2023-11-23',
      '2023-12-25',
    ]);
  });

  it.each([
    ['2023-01-02', "New Year's Day (observed)", true],
    ['2023-11-10', 'Veterans Day (observed)', true],
    ['2023-11-23', 'Thanksgiving Day', false],
  ])('OPM 2023 list: %s is %s', (date, name, observed) => {
    const h = observedFederalHolidays(2023).find((x) => x.date === date)!;
    expect(h.name).toBe(name);
    expect(h.observed).toBe(observed);
    expect(h.source).toBe('5 U.S.C. 6103(a)');
  });

  // Derived from 5 U.S.C. 6103(b): a Saturday holiday is observed the Friday before, even across a year end.
  it('5 U.S.C. 6103(b) [D]: New Year 2022 (Saturday) is observed Friday 2021-12-31, listed in 2021 not 2022', () => {
    expect(observedFederalHolidays(2021).map((h) => h.date)).toContain('2021-12-31');
    expect(observedFederalHolidays(2022).map((h) => h.date)).not.toContain('2022-01-01');
    expect(observedFederalHolidays(2022)).toHaveLength(10);
  });

  it.each([
    [2020, 10], // before Juneteenth (5 U.S.C. 6103 as amended 2021)
    [2024, 11],
    [2027, 12], // Dec 24 (Christmas observed) and Dec 31 (New Year 2028 observed) both fall in 2027
  ])('5 U.S.C. 6103: %i has %i observed holidays in the year', (year, n) => {
    expect(observedFederalHolidays(year)).toHaveLength(n);
  });

  it.each([
    [2024, ['2024-01-01', '2024-01-15', '2024-02-19', '2024-05-27', '2024-06-19', '2024-07-04', '2024-09-02', '2024-10-14', '2024-11-11', '2024-11-28', '2024-12-25']],
  ])('5 U.S.C. 6103 [D]: %i dates', (year, dates) => {
    expect(observedFederalHolidays(year).map((h) => h.date)).toEqual(dates);
  });

  it.each([[2023.5], [Number.NaN], [1800], [99999]])('bad year %p → RangeError', (y) => {
    expect(() => observedFederalHolidays(y)).toThrow(RangeError);
    expect(() => observedFederalHolidays(y)).toThrow(/year/);
  });
});
