/** Federal holidays, 5 U.S.C. 6103, and the holiday dates rulebook records can name. */
import type { HolidayName } from './jurisdiction-rule';
import { SOURCES } from './reasons';
import { dayNumberOf, isoOfDay, weekdayOf } from './time-zone';
import { checkNumber } from './validate';

export type ObservedHoliday = {
  date: string;
  name: string;
  holiday: HolidayName;
  /** True when the date is shifted from a weekend (Saturday → Friday, Sunday → Monday). */
  observed: boolean;
  source: string;
};

const FEDERAL: { holiday: HolidayName; name: string; since?: number }[] = [
  { holiday: 'new-years-day', name: "New Year's Day" },
  { holiday: 'mlk-day', name: 'Birthday of Martin Luther King, Jr.' },
  { holiday: 'washingtons-birthday', name: "Washington's Birthday" },
  { holiday: 'memorial-day', name: 'Memorial Day' },
  { holiday: 'juneteenth', name: 'Juneteenth National Independence Day', since: 2021 },
  { holiday: 'independence-day', name: 'Independence Day' },
  { holiday: 'labor-day', name: 'Labor Day' },
  { holiday: 'columbus-day', name: 'Columbus Day' },
  { holiday: 'veterans-day', name: 'Veterans Day' },
  { holiday: 'thanksgiving', name: 'Thanksgiving Day' },
  { holiday: 'christmas', name: 'Christmas Day' },
];

export const HOLIDAY_NAMES: Record<HolidayName, string> = {
  'new-years-day': "New Year's Day",
  'mlk-day': 'Birthday of Martin Luther King, Jr.',
  'washingtons-birthday': "Washington's Birthday",
  'memorial-day': 'Memorial Day',
  juneteenth: 'Juneteenth National Independence Day',
  'independence-day': 'Independence Day',
  'labor-day': 'Labor Day',
  'columbus-day': 'Columbus Day',
  'veterans-day': 'Veterans Day',
  thanksgiving: 'Thanksgiving Day',
  'day-after-thanksgiving': 'Day after Thanksgiving',
  'christmas-eve': 'Christmas Eve',
  christmas: 'Christmas Day',
};

/** Day number of the n-th `weekday` (0 = Sunday) of a month; n = −1 for the last. */
function nthWeekday(year: number, month: number, weekday: number, n: number): number {
  if (n > 0) {
    const first = dayNumberOf(year, month, 1);
    return first + ((weekday - weekdayOf(first) + 7) % 7) + (n - 1) * 7;
  }
  const last = dayNumberOf(year, month + 1, 1) - 1;
  return last - ((weekdayOf(last) - weekday + 7) % 7);
}

/** Calendar day number (days since 1970-01-01) of a holiday in a year, before any weekend shift. */
export function holidayDayNumber(holiday: HolidayName, year: number): number {
  switch (holiday) {
    case 'new-years-day':
      return dayNumberOf(year, 1, 1);
    case 'mlk-day':
      return nthWeekday(year, 1, 1, 3);
    case 'washingtons-birthday':
      return nthWeekday(year, 2, 1, 3);
    case 'memorial-day':
      return nthWeekday(year, 5, 1, -1);
    case 'juneteenth':
      return dayNumberOf(year, 6, 19);
    case 'independence-day':
      return dayNumberOf(year, 7, 4);
    case 'labor-day':
      return nthWeekday(year, 9, 1, 1);
    case 'columbus-day':
      return nthWeekday(year, 10, 1, 2);
    case 'veterans-day':
      return dayNumberOf(year, 11, 11);
    case 'thanksgiving':
      return nthWeekday(year, 11, 4, 4);
    case 'day-after-thanksgiving':
      return nthWeekday(year, 11, 4, 4) + 1;
    case 'christmas-eve':
      return dayNumberOf(year, 12, 24);
    case 'christmas':
      return dayNumberOf(year, 12, 25);
    default:
      throw new RangeError(`unknown holiday ${String(holiday)}`);
  }
}

/** Saturday → the Friday before, Sunday → the Monday after (5 U.S.C. 6103(b)). */
export function observedDayNumber(dayNumber: number): number {
  const wd = weekdayOf(dayNumber);
  return wd === 6 ? dayNumber - 1 : wd === 0 ? dayNumber + 1 : dayNumber;
}

/**
 * Federal holidays observed in `year` (5 U.S.C. 6103(a), with Saturday → Friday and Sunday → Monday), including
 * an observed date that falls in this year for next year's New Year's Day (e.g. Friday 2021-12-31).
 */
export function observedFederalHolidays(year: number): ObservedHoliday[] {
  checkNumber('year', year, { min: 1986, max: 2200, integer: true });
  const out: ObservedHoliday[] = [];
  for (const y of [year, year + 1]) {
    for (const h of FEDERAL) {
      if (h.since !== undefined && y < h.since) continue;
      const actual = holidayDayNumber(h.holiday, y);
      const obs = observedDayNumber(actual);
      const date = isoOfDay(obs);
      if (Number(date.slice(0, 4)) !== year) continue;
      out.push({
        date,
        name: obs === actual ? h.name : `${h.name} (observed)`,
        holiday: h.holiday,
        observed: obs !== actual,
        source: SOURCES.usc6103,
      });
    }
  }
  return out.sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
}
