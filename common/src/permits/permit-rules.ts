import { formatFeetInches, formatPounds } from '../engine/units';
import { localClock, localDate, zonedTimeToUtc } from '../engine/time-zone';
import { jurisdictionByCode } from '../geo/jurisdictions';
import type { AssessmentDto } from '../types/moves';
import type { PermittedFacts } from '../types/permits';

/** A value a permit rule cannot use, named by the request field it came from (the server answers it with 400). */
export class PermitFieldProblem extends RangeError {
  constructor(
    readonly field: string,
    readonly reason: string,
  ) {
    super(`${field}: ${reason}`);
    this.name = 'PermitFieldProblem';
  }
}

/** The zone a jurisdiction's permit times are read in. */
export const zoneOf = (code: string): string => jurisdictionByCode(code)?.timeZone ?? 'America/Chicago';

/** `YYYY-MM-DDTHH:mm` local wall-clock in `timeZone` → the instant; `field` names the value in a refusal. */
export function localToInstant(local: string, timeZone: string, field: string): Date {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(local);
  if (!m) throw new PermitFieldProblem(field, 'must be a local date and time, YYYY-MM-DDTHH:mm');
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  const day = Date.UTC(y, mo - 1, d);
  const back = new Date(day);
  if (back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d || h > 23 || mi > 59) throw new PermitFieldProblem(field, 'is not a real date and time');
  return new Date(zonedTimeToUtc(day / 86_400_000, h * 60 + mi, timeZone));
}

/** The instant as local wall-clock `YYYY-MM-DDTHH:mm` in `timeZone`. */
export const instantToLocal = (d: Date, timeZone: string): string => `${localDate(d.getTime(), timeZone)}T${localClock(d.getTime(), timeZone)}`;

/** From local midnight of the first travel day to local midnight after the last one. */
export function travelSpan(dates: string[], timeZone: string): { start: Date; end: Date } {
  const first = dates[0];
  const last = dates[dates.length - 1];
  const start = localToInstant(`${first}T00:00`, timeZone, 'travelDates');
  const after = new Date(Date.parse(`${last}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
  return { start, end: localToInstant(`${after}T00:00`, timeZone, 'travelDates') };
}

/** The plan's figures that a permit is issued for, from an assessment. */
export function factsFromAssessment(a: AssessmentDto, code: string, planRevision: number): PermittedFacts {
  const d = a.result.dimensions;
  const w = a.result.axleLoads;
  const j = a.result.jurisdictions.find((x) => x.code === code);
  const r1 = (v: number) => Math.round(v * 10) / 10;
  return {
    widthIn: r1(d.widthIn),
    heightIn: r1(d.heightIn),
    lengthIn: r1(d.lengthIn),
    frontOverhangIn: r1(d.frontOverhangIn),
    rearOverhangIn: r1(d.rearOverhangIn),
    grossLb: Math.round(w.grossLb),
    steerLb: Math.round(w.steerLb),
    driveLb: Math.round(w.driveLb),
    trailerLb: Math.round(w.trailerLb),
    miles: r1(j?.miles ?? 0),
    planRevision,
  };
}

/**
 * What differs between the figures a permit was issued for and the new plan: any dimension or weight now above
 * what was permitted (half an inch / 100 lb of rounding allowed), or a different mileage in the state (a route
 * change). A smaller load within the permitted figures does not need an amendment.
 */
export function permittedDifferences(permitted: PermittedFacts, now: PermittedFacts): string[] {
  const out: string[] = [];
  const dims: [keyof PermittedFacts, string][] = [
    ['widthIn', 'width'], ['heightIn', 'height'], ['lengthIn', 'length'], ['frontOverhangIn', 'front overhang'], ['rearOverhangIn', 'rear overhang'],
  ];
  for (const [k, label] of dims) {
    if (now[k] > permitted[k] + 0.5) out.push(`${label} ${formatFeetInches(permitted[k])} permitted, now ${formatFeetInches(now[k])}`);
  }
  const weights: [keyof PermittedFacts, string][] = [['grossLb', 'gross'], ['steerLb', 'steer axle'], ['driveLb', 'drive axles'], ['trailerLb', 'trailer axles']];
  for (const [k, label] of weights) {
    if (now[k] > permitted[k] + 100) out.push(`${label} ${formatPounds(permitted[k])} permitted, now ${formatPounds(now[k])}`);
  }
  if (Math.abs(now.miles - permitted.miles) >= 0.5) out.push(`route in the state ${permitted.miles} mi permitted, now ${now.miles} mi`);
  return out;
}

/**
 * A stored file name from whatever the browser sent: the last path part only, no control characters, a safe
 * character set, at most 120 characters, ending in .pdf. Throws (field `file`) when nothing usable is left.
 */
export function sanitizeFileName(raw: string | undefined): string {
  const name = String(raw ?? '');
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(name)) throw new PermitFieldProblem('file', 'the file name contains control characters');
  const last = name.split(/[\\/]/).pop() ?? '';
  let clean = last
    .normalize('NFKC')
    .replace(/[^A-Za-z0-9._ ()-]+/g, '_')
    .replace(/_+/g, '_')
    .replace(/^[.\s_-]+/, '')
    .trim();
  if (!clean || /^\.*$/.test(clean)) throw new PermitFieldProblem('file', 'the file name has no usable part (give the PDF a name)');
  if (!/\.pdf$/i.test(clean)) clean = `${clean}.pdf`;
  if (clean.length > 120) clean = `${clean.slice(0, 116)}.pdf`;
  return clean;
}

/** One CSV cell: quoted when needed, and a leading = + - @ neutralised so spreadsheets do not run it. */
export function csvCell(v: unknown): string {
  let s = v === null || v === undefined ? '' : String(v);
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export const usd = (cents: number | null): number | null => (cents === null ? null : Math.round(cents) / 100);
export const cents = (dollars: number): number => Math.round(dollars * 100);
