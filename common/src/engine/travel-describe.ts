/** Travel rules in plain words, shared by the desk, the run sheet and the permit-versus-rulebook comparison. */
import { HOLIDAY_NAMES } from './holidays';
import type { DaylightRule, HolidayRule, WeekendRule } from './jurisdiction-rule';

const DAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const off = (m: number, what: string): string => (m === 0 ? what : `${Math.abs(m)} min ${m < 0 ? 'before' : 'after'} ${what}`);

/** "30 min before sunrise to 30 min after sunset". */
export const describeDaylight = (d: Pick<DaylightRule, 'startOffsetMin' | 'endOffsetMin'>): string => `${off(d.startOffsetMin, 'sunrise')} to ${off(d.endOffsetMin, 'sunset')}`;

/** "weekend travel allowed" or "no travel: Sat 12:00–24:00, Sun". */
export const describeWeekends = (w: Pick<WeekendRule, 'bans'>): string =>
  w.bans.length === 0 ? 'weekend travel allowed' : `no travel: ${w.bans.map((b) => `${DAYS[b.day]}${b.from || b.to ? ` ${b.from ?? '00:00'}–${b.to ?? '24:00'}` : ''}`).join(', ')}`;

const HOLIDAY_FROM_WORDS: Record<HolidayRule['from'], string> = {
  'noon-weekday-before': 'from noon of the weekday before',
  'noon-day-before': 'from noon of the day before',
  'day-only': 'the day itself',
};

/** "New Year's Day, Christmas Day; from noon of the weekday before; observed date". */
export const describeHolidays = (h: Pick<HolidayRule, 'names' | 'from' | 'observance' | 'until'>): string =>
  h.names.length === 0
    ? 'no holiday limit'
    : `${h.names.map((n) => HOLIDAY_NAMES[n] ?? n).join(', ')}; ${HOLIDAY_FROM_WORDS[h.from] ?? h.from}${h.until ? ` until ${h.until}` : ''}; ${h.observance === 'both' ? 'calendar and observed dates' : h.observance === 'actual' ? 'calendar date' : 'observed date'}`;
