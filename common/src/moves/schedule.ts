/**
 * One place for the dates that must agree: the day plan (which state on which day, from the route's miles and a
 * daily distance) checked against each state's travel windows, the issued permits' validity and the confirmed
 * escorts' dates. Pure: the server gathers the facts, the desk shows the result.
 */
import { validityGaps } from '../engine/permit-terms';
import { formatZoned } from '../engine/time-zone';
import type { TravelWindowsResult } from '../engine/travel-windows';

/**
 * Miles a day when the dispatcher sets none: the route's miles spread over the planned travel days. Planning
 * figure only; hours of service, curfews and the permit's hours decide the real distance.
 */
export const defaultDailyMiles = (totalMiles: number, travelDays: number): number => Math.max(1, Math.ceil(totalMiles / Math.max(1, travelDays)));

export type DayPlanSegment = { order: number; jurisdiction: string; miles: number };
export type PlannedDay = {
  date: string;
  /** States driven that day, in route order, with the miles in each. */
  states: { jurisdiction: string; miles: number }[];
  miles: number;
};
export type DayPlan = { dailyMiles: number; days: PlannedDay[]; totalMiles: number; daysNeeded: number };

/**
 * Walks the route in order, `dailyMiles` a day (the last planned day takes what is left, so every state is on some
 * day). `daysNeeded` is what the route takes at that distance; more than the planned days is the caller's error.
 */
export function dayPlan(segments: readonly DayPlanSegment[], dates: readonly string[], dailyMiles: number): DayPlan {
  if (!(dailyMiles > 0)) throw new RangeError('dailyMiles must be more than 0');
  if (dates.length === 0) throw new RangeError('the move has no travel days');
  const ordered = [...segments].sort((a, b) => a.order - b.order);
  const totalMiles = ordered.reduce((s, x) => s + x.miles, 0);
  const daysNeeded = Math.max(1, Math.ceil(totalMiles / dailyMiles - 1e-9));
  const days: PlannedDay[] = dates.map((date) => ({ date, states: [], miles: 0 }));
  let day = 0;
  let room = dailyMiles;
  const add = (d: number, code: string, miles: number) => {
    const s = days[d].states.at(-1);
    if (s && s.jurisdiction === code) s.miles += miles;
    else days[d].states.push({ jurisdiction: code, miles });
    days[d].miles += miles;
  };
  for (const seg of ordered) {
    let left = seg.miles;
    if (left === 0) add(day, seg.jurisdiction, 0);
    while (left > 1e-9) {
      const last = day === days.length - 1;
      const take = last ? left : Math.min(left, room);
      add(day, seg.jurisdiction, take);
      left -= take;
      room -= take;
      if (room <= 1e-9 && !last) {
        day += 1;
        room = dailyMiles;
      }
    }
  }
  for (const d of days) for (const s of d.states) s.miles = Math.round(s.miles * 10) / 10;
  return { dailyMiles, days, totalMiles, daysNeeded };
}

/** The dates the day plan puts each state on. */
export function datesByState(plan: DayPlan): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const d of plan.days) {
    for (const s of d.states) {
      const list = (out[s.jurisdiction] ??= []);
      if (!list.includes(d.date)) list.push(d.date);
    }
  }
  return out;
}

export type ScheduleFinding = { code: string; date: string | null; jurisdiction: string | null; message: string; blocking: boolean };

export type ScheduleInput = {
  plan: DayPlan;
  /** Each state's travel windows by date (the assessment's). */
  travel: Record<string, TravelWindowsResult[]>;
  /** States that need a permit. */
  permitsNeeded: string[];
  /** Issued permits' validity, by state. */
  permits: Record<string, { validFrom: string; validTo: string } | undefined>;
  /** Escort positions the move needs, each with the states it is needed in. */
  escortSlots: { label: string; jurisdictions: string[] }[];
  /** Confirmed escort bookings (inclusive local dates). */
  escorts: { label: string; jurisdictions: string[]; startDate: string; endDate: string }[];
  timeZoneOf: (code: string) => string;
};

export type ScheduleDay = PlannedDay & { findings: ScheduleFinding[] };
export type ScheduleResult = { plan: DayPlan; days: ScheduleDay[]; findings: ScheduleFinding[]; ok: boolean };

/**
 * For every planned day and every state driven that day: a legal travel window exists, the issued permit covers
 * the windows of that day (to the minute), and each escort position needed there is confirmed for that date.
 * Missing permits and escorts are the other guards' business; this checks only what is recorded.
 */
export function scheduleCheck(input: ScheduleInput): ScheduleResult {
  const findings: ScheduleFinding[] = [];
  const days: ScheduleDay[] = input.plan.days.map((d) => ({ ...d, findings: [] }));
  const push = (day: ScheduleDay | null, f: ScheduleFinding) => {
    findings.push(f);
    day?.findings.push(f);
  };
  if (input.plan.daysNeeded > input.plan.days.length) {
    push(null, {
      code: 'days_short', date: null, jurisdiction: null, blocking: true,
      message: `at ${input.plan.dailyMiles} mi a day the route's ${Math.round(input.plan.totalMiles)} mi take ${input.plan.daysNeeded} days; the move plans ${input.plan.days.length}`,
    });
  }
  for (const day of days) {
    for (const s of day.states) {
      const code = s.jurisdiction;
      const windows = (input.travel[code] ?? []).find((t) => t.date === day.date);
      if (windows && !windows.allowed) {
        push(day, { code: 'no_window', date: day.date, jurisdiction: code, blocking: true, message: `${code} on ${day.date}: no legal travel window (${windows.restrictions.map((r) => r.message).join('; ') || 'no window'})` });
      }
      const p = input.permits[code];
      if (p && windows) {
        const tz = input.timeZoneOf(code);
        for (const g of validityGaps([windows], new Date(p.validFrom), new Date(p.validTo), (d) => formatZoned(d.getTime(), tz))) {
          push(day, { code: 'permit_validity', date: day.date, jurisdiction: code, blocking: true, message: `${code} permit on ${day.date}: ${g.message}` });
        }
      }
      for (const slot of input.escortSlots.filter((x) => x.jurisdictions.includes(code))) {
        const booked = input.escorts.filter((e) => e.label === slot.label && e.jurisdictions.includes(code));
        if (booked.length && !booked.some((e) => e.startDate <= day.date && day.date <= e.endDate)) {
          push(day, { code: 'escort_dates', date: day.date, jurisdiction: code, blocking: true, message: `${slot.label} in ${code} is confirmed for ${booked.map((e) => `${e.startDate} to ${e.endDate}`).join(', ')}, not for ${day.date}` });
        }
      }
    }
  }
  return { plan: input.plan, days, findings, ok: !findings.some((f) => f.blocking) };
}
