import { fileByDate, pastFileBy } from './file-by';

describe('fileByDate', () => {
  it.each([
    // source: the desk's rule (requested departure less the state's lead time), as the permit queue's trigger stores it;
    // the lead times are the rulebook's per-state permit lead times (common practice, no published source for the arithmetic)
    { departure: '2026-12-10', lead: 2, fileBy: '2026-12-08', why: 'two days before departure' },
    { departure: '2026-12-10', lead: 0, fileBy: '2026-12-10', why: 'lead time not on file: file by the departure at the latest' },
    { departure: '2026-03-02', lead: 3, fileBy: '2026-02-27', why: 'across the end of a 28-day February' },
    { departure: '2028-03-01', lead: 1, fileBy: '2028-02-29', why: 'into a leap day' },
    { departure: '2027-01-02', lead: 5, fileBy: '2026-12-28', why: 'across a year end' },
    { departure: '2026-11-02', lead: 1, fileBy: '2026-11-01', why: 'calendar days, not affected by the daylight-saving change (1 Nov 2026 in the US)' },
    { departure: '2026-12-10', lead: 30, fileBy: '2026-11-10', why: 'a superload lead time of 30 days' },
  ])('$departure less $lead days is $fileBy ($why)', ({ departure, lead, fileBy }) => {
    expect(fileByDate(departure, lead)).toBe(fileBy);
  });

  it.each([
    { departure: '2026-12-1', lead: 2 },
    { departure: 'soon', lead: 2 },
    { departure: '2026-12-10', lead: -1 },
    { departure: '2026-12-10', lead: 1.5 },
  ])('refuses $departure with $lead days (common practice, no published source)', ({ departure, lead }) => {
    expect(() => fileByDate(departure, lead)).toThrow(RangeError);
  });
});

describe('pastFileBy', () => {
  it.each([
    // common practice, no published source: overdue once the file-by day itself is over
    { fileBy: '2026-12-08', today: '2026-12-07', past: false },
    { fileBy: '2026-12-08', today: '2026-12-08', past: false },
    { fileBy: '2026-12-08', today: '2026-12-09', past: true },
  ])('file by $fileBy, today $today: past $past', ({ fileBy, today, past }) => {
    expect(pastFileBy(fileBy, today)).toBe(past);
  });
});
