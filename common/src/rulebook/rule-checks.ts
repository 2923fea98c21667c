/**
 * Check values read from a record's cited texts (`checks/<CODE>.json`), and how each is run against the engine.
 * Shared by the data tests and the admin's rule editor (a check that fails after an edit is shown there).
 */
import { assessJurisdiction } from '../engine/assess-jurisdiction';
import type { JurisdictionRule, MeasuredLoad, RoadType } from '../engine/jurisdiction-rule';
import { travelWindows } from '../engine/travel-windows';
import { zonedTimeToUtc, dayNumberOf } from '../engine/time-zone';

type Load = Partial<MeasuredLoad> & { sideProjectionLeftIn?: number; sideProjectionRightIn?: number };
type Common = { name: string; citation: string; quote?: string };
export type RuleCheck = Common &
  (
    | { kind: 'value'; path: string; expect: unknown }
    | { kind: 'permit'; load: Load; expect: { permitRequired: boolean } }
    | { kind: 'escorts'; load: Load; roadType: RoadType; expect: { front: number; rear: number; heightPole?: boolean; known?: boolean } }
    | { kind: 'travel'; date: string; time: string; lat: number; lon: number; timeZone: string; load?: Load; urban?: boolean; expect: { allowed: boolean; known?: boolean } }
    | { kind: 'fee'; load: Load; miles: number; roadType?: RoadType; expect: { totalUsd: number } }
  );
export type RuleChecksFile = { code: string; checks: RuleCheck[] };

/** A legal 8 ft 6 in × 13 ft 6 in × 65 ft, 80,000 lb load with nothing projecting: checks give only what differs. */
export const CHECK_BASE_LOAD: MeasuredLoad = {
  widthIn: 102,
  heightIn: 162,
  lengthIn: 780,
  frontOverhangIn: 0,
  rearOverhangIn: 0,
  sideProjectionIn: 0,
  grossLb: 80_000,
};

const loadOf = (l: Load | undefined) => ({ ...CHECK_BASE_LOAD, ...(l ?? {}) });

/** The value at a dotted path of a record; a fact yields its value (or `"unknown"`). */
export function valueAtPath(r: JurisdictionRule, path: string): unknown {
  let v: unknown = r;
  for (const part of path.split('.')) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<string, unknown>)[part];
    if (v && typeof v === 'object' && 'status' in (v as object) && !Array.isArray(v)) {
      const f = v as { status: string; value?: unknown };
      v = f.status === 'unknown' ? 'unknown' : f.value;
    }
  }
  return v;
}

export type CheckOutcome = { ok: boolean; actual: unknown };

/** Runs one check against a record. */
export function runRuleCheck(r: JurisdictionRule, c: RuleCheck): CheckOutcome {
  switch (c.kind) {
    case 'value': {
      const actual = valueAtPath(r, c.path);
      return { ok: JSON.stringify(actual) === JSON.stringify(c.expect), actual };
    }
    case 'permit': {
      const a = assessJurisdiction(r, { dimensions: loadOf(c.load), miles: 100, roadTypes: ['interstate'] });
      return { ok: a.permitRequired === c.expect.permitRequired, actual: { permitRequired: a.permitRequired } };
    }
    case 'escorts': {
      const a = assessJurisdiction(r, { dimensions: loadOf(c.load), miles: 100, roadTypes: [c.roadType] });
      const actual = { front: a.escorts.front, rear: a.escorts.rear, heightPole: a.escorts.heightPole, known: a.escorts.known };
      const ok =
        actual.front === c.expect.front &&
        actual.rear === c.expect.rear &&
        (c.expect.heightPole === undefined || actual.heightPole === c.expect.heightPole) &&
        (c.expect.known === undefined || actual.known === c.expect.known);
      return { ok, actual };
    }
    case 'travel': {
      const load = loadOf(c.load);
      // the load facts the curfew exemptions read, as the plan check derives them
      const a = assessJurisdiction(r, { dimensions: load, miles: 100, roadTypes: ['interstate'] });
      const overLegal = a.permitReasons.filter((x) => x.code.startsWith('over-legal-')).map((x) => x.code);
      const w = travelWindows({
        date: c.date,
        lat: c.lat,
        lon: c.lon,
        timeZone: c.timeZone,
        rule: r,
        urban: c.urban ?? false,
        load: {
          widthIn: load.widthIn,
          heightIn: load.heightIn,
          lengthIn: load.lengthIn,
          grossLb: load.grossLb,
          overweightOnly: a.overweight && !a.oversize,
          overlengthOnly: !a.overweight && overLegal.length === 1 && overLegal[0] === 'over-legal-length',
        },
      });
      const [y, mo, d] = c.date.split('-').map(Number);
      const [hh, mm] = c.time.split(':').map(Number);
      const instant = zonedTimeToUtc(dayNumberOf(y, mo, d), hh * 60 + mm, c.timeZone);
      const allowed = w.intervals.some((iv) => Date.parse(iv.start) <= instant && instant < Date.parse(iv.end));
      const actual = { allowed, known: w.known, intervals: w.intervals.map((i) => `${i.startLocal}-${i.endLocal}`) };
      return { ok: allowed === c.expect.allowed && (c.expect.known === undefined || w.known === c.expect.known), actual };
    }
    case 'fee': {
      const a = assessJurisdiction(r, { dimensions: loadOf(c.load), miles: c.miles, roadTypes: [c.roadType ?? 'interstate'] });
      const total = a.fee?.known ? a.fee.totalUsd : a.fee ? 'unknown' : 'no permit';
      return { ok: total === c.expect.totalUsd, actual: { totalUsd: total, lines: a.fee?.known ? a.fee.lines.map((l) => `${l.label} ${l.amountUsd}`) : [] } };
    }
    default:
      return { ok: false, actual: `unknown check kind ${String((c as { kind: unknown }).kind)}` };
  }
}
