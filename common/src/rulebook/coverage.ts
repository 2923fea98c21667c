/** Rulebook coverage: for every jurisdiction and topic, whether the value is sourced, secondary or not on file. */
import { ESCORT_MEASURES, type Fact, type FactStatus, type JurisdictionRule } from '../engine/jurisdiction-rule';

/** Every fact of a record with its path (e.g. `legal.widthIn`, `escorts.width`, `travel.daylight`). */
export function factsOf(r: JurisdictionRule): [string, Fact<unknown>][] {
  const out: [string, Fact<unknown>][] = [];
  const L = r.legal;
  for (const k of Object.keys(L) as (keyof typeof L)[]) out.push([`legal.${k}`, L[k] as Fact<unknown>]);
  const P = r.permit;
  for (const k of Object.keys(P) as (keyof typeof P)[]) out.push([`permit.${k}`, P[k] as Fact<unknown>]);
  out.push(['superload', r.superload]);
  for (const k of [...ESCORT_MEASURES, 'twoDimensionRule', 'heightPoleMarginIn', 'certification'] as const) out.push([`escorts.${k}`, r.escorts[k] as Fact<unknown>]);
  out.push(['signs', r.signs], ['flags', r.flags], ['lamps', r.lamps]);
  const T = r.travel;
  for (const k of Object.keys(T) as (keyof typeof T)[]) out.push([`travel.${k}`, T[k] as Fact<unknown>]);
  out.push(['fee', r.fee], ['speed', r.speed]);
  return out;
}

/** The topics of the coverage matrix: groups of facts, shown as one cell each. */
export const COVERAGE_TOPICS: { key: string; label: string; paths: string[] }[] = [
  { key: 'legal.dimensions', label: 'Legal dimensions', paths: ['legal.widthIn', 'legal.heightIn', 'legal.overallLengthIn', 'legal.semitrailerLengthIn', 'legal.frontOverhangIn', 'legal.rearOverhangIn'] },
  { key: 'legal.weights', label: 'Legal weights', paths: ['legal.singleAxleLb', 'legal.tandemLb', 'legal.tridemLb', 'legal.grossLb', 'legal.bridge', 'legal.tireLbPerInch'] },
  { key: 'permit', label: 'Permit classes and maxima', paths: ['permit.classes', 'permit.routineMaxima', 'permit.validityDays', 'permit.leadTimeDays'] },
  { key: 'superload', label: 'Superload', paths: ['superload'] },
  { key: 'escorts', label: 'Escorts', paths: ESCORT_MEASURES.map((m) => `escorts.${m}`).concat(['escorts.twoDimensionRule', 'escorts.heightPoleMarginIn', 'escorts.certification']) },
  { key: 'travel.hours', label: 'Travel hours', paths: ['travel.daylight', 'travel.minVisibilityFt'] },
  { key: 'travel.weekends', label: 'Weekends', paths: ['travel.weekends'] },
  { key: 'travel.holidays', label: 'Holidays', paths: ['travel.holidays'] },
  { key: 'travel.curfews', label: 'Curfews', paths: ['travel.curfews'] },
  { key: 'fee', label: 'Fee', paths: ['fee'] },
  { key: 'markings', label: 'Signs, flags, lamps', paths: ['signs', 'flags', 'lamps'] },
  { key: 'speed', label: 'Speed', paths: ['speed'] },
];

export type CoverageCell = {
  topic: string;
  /** `sourced` when every fact of the topic is sourced; `secondary` when all are known and one is secondary; `partial` when some are not on file; `unknown` when none is on file. */
  status: FactStatus | 'partial';
  sourced: number;
  secondary: number;
  unknown: number;
  oldestAsOf: string | null;
};

export type CoverageRow = { code: string; name: string; version: number | null; cells: CoverageCell[]; sourced: number; secondary: number; unknown: number; oldestAsOf: string | null };

export type RulebookCoverage = {
  topics: { key: string; label: string }[];
  rows: CoverageRow[];
  totals: { jurisdictions: number; facts: number; sourced: number; secondary: number; unknown: number; oldestAsOf: string | null };
};

const older = (a: string | null, b: string | null): string | null => (a === null ? b : b === null ? a : a < b ? a : b);

export function coverageRow(r: JurisdictionRule, version: number | null = null): CoverageRow {
  const facts = new Map(factsOf(r));
  let sourced = 0;
  let secondary = 0;
  let unknown = 0;
  let oldest: string | null = null;
  const cells = COVERAGE_TOPICS.map((t) => {
    const c = { sourced: 0, secondary: 0, unknown: 0, oldestAsOf: null as string | null };
    for (const p of t.paths) {
      const f = facts.get(p);
      if (!f || f.status === 'unknown') c.unknown++;
      else {
        c[f.status]++;
        c.oldestAsOf = older(c.oldestAsOf, f.asOf);
      }
    }
    sourced += c.sourced;
    secondary += c.secondary;
    unknown += c.unknown;
    oldest = older(oldest, c.oldestAsOf);
    const status: CoverageCell['status'] =
      c.unknown === t.paths.length ? 'unknown' : c.unknown > 0 ? 'partial' : c.secondary > 0 ? 'secondary' : 'sourced';
    return { topic: t.key, status, ...c };
  });
  return { code: r.code, name: r.name, version, cells, sourced, secondary, unknown, oldestAsOf: oldest };
}

export function rulebookCoverage(records: { record: JurisdictionRule; version?: number }[]): RulebookCoverage {
  const rows = records.map((x) => coverageRow(x.record, x.version ?? null)).sort((a, b) => a.name.localeCompare(b.name));
  const sum = (k: 'sourced' | 'secondary' | 'unknown'): number => rows.reduce((s, r) => s + r[k], 0);
  return {
    topics: COVERAGE_TOPICS.map(({ key, label }) => ({ key, label })),
    rows,
    totals: {
      jurisdictions: rows.length,
      facts: sum('sourced') + sum('secondary') + sum('unknown'),
      sourced: sum('sourced'),
      secondary: sum('secondary'),
      unknown: sum('unknown'),
      oldestAsOf: rows.reduce<string | null>((o, r) => older(o, r.oldestAsOf), null),
    },
  };
}

/** The coverage as plain text lines (for `npm run rulebook:coverage`). */
export function formatCoverage(c: RulebookCoverage): string {
  const mark = { sourced: 'S', secondary: 's', partial: '~', unknown: '.' } as const;
  const lines = [`code  ${c.topics.map((t) => t.key.split('.').pop()!.slice(0, 3).padEnd(4)).join('')}sourced secondary unknown  oldest`];
  for (const r of c.rows) {
    lines.push(
      `${r.code.padEnd(6)}${r.cells.map((x) => mark[x.status].padEnd(4)).join('')}${String(r.sourced).padStart(7)} ${String(r.secondary).padStart(9)} ${String(r.unknown).padStart(7)}  ${r.oldestAsOf ?? '-'}`,
    );
  }
  const t = c.totals;
  lines.push(
    `${t.jurisdictions} jurisdictions, ${t.facts} facts: ${t.sourced} sourced, ${t.secondary} secondary, ${t.unknown} not on file; oldest as-of ${t.oldestAsOf ?? '-'}`,
  );
  lines.push('S = all sourced, s = all known (some secondary), ~ = partly on file, . = not on file');
  return lines.join('\n');
}
