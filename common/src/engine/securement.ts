/** Cargo securement, 49 CFR 393 Subpart I: tiedown count, working load limits and the heavy-equipment rule. */
import { PLANNING_CAUTION, Reason, SOURCES } from './reasons';
import { formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

const EPS = 1e-9;

export type MinimumTiedownsInput = { lengthFt: number; weightLb: number; blockedForward: boolean };

/**
 * 49 CFR 393.110. Not blocked forward: 1 tiedown for an article 5 ft or shorter and 1,100 lb or lighter;
 * 2 if 5 ft or shorter and heavier, or longer than 5 ft up to 10 ft; longer than 10 ft: 2 for the first 10 ft
 * plus 1 for every further 10 ft or fraction. Blocked forward: 1 for every 10 ft or fraction.
 */
export function minimumTiedowns(input: MinimumTiedownsInput): number {
  const L = checkNumber('lengthFt', input.lengthFt, { min: 0, minExclusive: true, max: ABSURD.lengthFt, unit: 'ft' });
  const W = checkNumber('weightLb', input.weightLb, { min: 0, minExclusive: true, max: ABSURD.weightLb, unit: 'lb' });
  if (typeof input.blockedForward !== 'boolean') throw new RangeError('blockedForward must be true or false');
  if (input.blockedForward) return Math.max(1, Math.ceil(L / 10 - EPS));
  if (L <= 5 + EPS) return W <= 1100 ? 1 : 2;
  if (L <= 10 + EPS) return 2;
  return 2 + Math.ceil((L - 10) / 10 - EPS);
}

export type TiedownPath = 'direct' | 'same-side' | 'side-to-side';

export type CreditedWllInput = { wllLb: number; anchorWllLb?: number; path: TiedownPath };

/**
 * 393.108(a): a tiedown is rated at the lowest of its own WLL and its anchor point's; then 393.106(d):
 * half of that for a direct tiedown or one that returns to the same side, the full value side to side.
 */
export function creditedWll(input: CreditedWllInput): number {
  const wll = checkNumber('wllLb', input.wllLb, { min: 0, max: 200_000, unit: 'lb' });
  const anchor =
    input.anchorWllLb === undefined ? Infinity : checkNumber('anchorWllLb', input.anchorWllLb, { min: 0, max: 200_000, unit: 'lb' });
  const rated = Math.min(wll, anchor);
  switch (input.path) {
    case 'side-to-side':
      return rated;
    case 'direct':
    case 'same-side':
      return rated / 2;
    default:
      throw new RangeError(`path must be 'direct', 'same-side' or 'side-to-side'; got ${String(input.path)}`);
  }
}

export type ChainGrade = 30 | 43 | 70 | 80 | 100;

export type SyntheticRopeFiber = 'polypropylene' | 'polyester' | 'nylon' | 'double-braided-nylon';

export type DefaultWllInput =
  /** Chain by nominal size ('3/8', '3/8 in' or '10 mm') and grade; an unmarked chain counts as grade 30 (393.108(d)). */
  | { kind: 'chain'; size: string; grade?: ChainGrade }
  /** Synthetic webbing by width ('2', '1 3/4', '50 mm'). */
  | { kind: 'webbing'; width: string }
  /** Wire rope, 6 × 37 fiber core, by diameter; wire of unknown construction counts as 6 × 37 fiber core (393.108(e)(2)). */
  | { kind: 'wire-rope'; diameter: string }
  /** Manila rope by diameter (393.108(f)). */
  | { kind: 'manila-rope'; diameter: string }
  /** Synthetic fiber rope by diameter; cordage of unknown fiber counts as polypropylene (393.108(c)). */
  | { kind: 'synthetic-rope'; diameter: string; fiber?: SyntheticRopeFiber };

/**
 * The default working load limits of 49 CFR 393.108, in lb, by nominal size in inches. Chain, webbing and wire rope
 * to 3/4 in: the regulation's tables (references §3, read in the regulation; the same cells in the reproduction of
 * the "Tables to §393.108"). Wire rope 7/8 and 1 in, manila and synthetic fiber rope: the table as first published,
 * 59 FR (July 6, 1994), FR Doc. 94-16069, "Tables to §393.102(b)(6)" — since carried into §393.108; these rows were
 * not read in the current eCFR text. Not held (the text was not read): double braided nylon rope, steel strapping.
 */
const CHAIN_WLL: Record<string, Partial<Record<ChainGrade, number>>> = {
  '1/4': { 30: 1_300, 43: 2_600, 70: 3_150, 80: 3_500, 100: 4_300 },
  // Grade 80 is lower than grade 70 at this size in the table itself.
  '5/16': { 30: 1_900, 43: 3_900, 70: 4_700, 80: 4_500, 100: 5_700 },
  '3/8': { 30: 2_650, 43: 5_400, 70: 6_600, 80: 7_100, 100: 8_800 },
  // The table lists no grade 80 or grade 100 chain in 7/16 in.
  '7/16': { 30: 3_700, 43: 7_200, 70: 8_750 },
  '1/2': { 30: 4_500, 43: 9_200, 70: 11_300, 80: 12_000, 100: 15_000 },
  '5/8': { 30: 6_900, 43: 13_000, 70: 15_800, 80: 18_100, 100: 22_600 },
};
const WEBBING_WLL: Record<string, number> = { '1 3/4': 1_750, '2': 2_000, '3': 3_000, '4': 4_000 };
const WIRE_ROPE_WLL: Record<string, number> = {
  '1/4': 1_400,
  '5/16': 2_100,
  '3/8': 3_000,
  '7/16': 4_100,
  '1/2': 5_300,
  '5/8': 8_300,
  '3/4': 10_900,
  '7/8': 16_100,
  '1': 20_900,
};
const MANILA_WLL: Record<string, number> = { '3/8': 205, '7/16': 265, '1/2': 315, '5/8': 465, '3/4': 640, '1': 1_050 };
const SYNTHETIC_ROPE_WLL: Record<Exclude<SyntheticRopeFiber, 'double-braided-nylon'>, Record<string, number>> = {
  polypropylene: { '3/8': 400, '7/16': 525, '1/2': 625, '5/8': 925, '3/4': 1_275, '1': 2_100 },
  polyester: { '3/8': 555, '7/16': 750, '1/2': 960, '5/8': 1_500, '3/4': 1_880, '1': 3_300 },
  nylon: { '3/8': 278, '7/16': 410, '1/2': 525, '5/8': 935, '3/4': 1_420, '1': 2_520 },
};
/** The metric sizes the tables print beside the inch sizes (mm → in). */
const METRIC_SIZES: Record<string, string> = {
  '7': '1/4',
  '8': '5/16',
  '10': '3/8',
  '11': '7/16',
  '13': '1/2',
  '16': '5/8',
  '20': '3/4',
  '22': '7/8',
  '25': '1',
  '45': '1 3/4',
  '50': '2',
  '75': '3',
  '100': '4',
};
const FIRST_PUBLISHED = '59 FR (July 6, 1994), FR Doc. 94-16069, tables to §393.102(b)(6), carried into §393.108';

/** '3/8', '3/8"', '3/8 in', '1-3/4', '10 mm' → the table's inch key. */
function sizeKey(raw: string): string {
  let v = String(raw).trim().toLowerCase().replace(/\s+/g, ' ');
  const mm = /^(\d+)\s?mm$/.exec(v);
  if (mm) return METRIC_SIZES[mm[1]] ?? `${mm[1]} mm`;
  v = v.replace(/\s?(inches|inch|in\.?|")$/, '').trim();
  return v.replace(/^(\d+)-(\d+\/\d+)$/, '$1 $2');
}

const noDefault = (what: string): never => {
  throw new RangeError(`${what}: no default WLL on file; use the WLL marked on it (49 CFR 393.108(b))`);
};

/**
 * Default working load limit from the 49 CFR 393.108 tables. Cells the tables do not list (e.g. grade 80 chain in
 * 7/16 in) and rows not held here throw a RangeError asking for the marked WLL (393.108(b): marked values
 * override the table). Unmarked chain counts as grade 30 proof coil (393.108(d)); synthetic cordage of unknown fiber
 * as polypropylene (393.108(c)); wire of unknown construction as 6 × 37 fiber core (393.108(e)(2)).
 */
export function defaultWll(input: DefaultWllInput): { wllLb: number; source: string; note?: string } {
  if (input.kind === 'chain') {
    const grade: ChainGrade = input.grade ?? 30;
    const row = CHAIN_WLL[sizeKey(input.size)];
    const wll = row?.[grade];
    if (wll === undefined) noDefault(`chain size "${input.size}" grade ${grade}`);
    return {
      wllLb: wll!,
      source: `${SOURCES.cfr393_108} table`,
      note: input.grade === undefined ? 'unmarked chain counts as grade 30 (49 CFR 393.108(d))' : undefined,
    };
  }
  if (input.kind === 'webbing') {
    const wll = WEBBING_WLL[sizeKey(input.width)];
    if (wll === undefined) {
      throw new RangeError(`webbing width "${input.width}" in: no default WLL on file; use the marked WLL (49 CFR 393.108(b))`);
    }
    return { wllLb: wll, source: `${SOURCES.cfr393_108} table` };
  }
  if (input.kind === 'wire-rope') {
    const key = sizeKey(input.diameter);
    const wll = WIRE_ROPE_WLL[key];
    if (wll === undefined) noDefault(`wire rope "${input.diameter}"`);
    return {
      wllLb: wll!,
      source: key === '7/8' || key === '1' ? `${SOURCES.cfr393_108} table (${FIRST_PUBLISHED})` : `${SOURCES.cfr393_108} table`,
      note: 'wire rope 6 × 37, fiber core; wire of unknown construction counts as such (49 CFR 393.108(e)(2))',
    };
  }
  if (input.kind === 'manila-rope') {
    const wll = MANILA_WLL[sizeKey(input.diameter)];
    if (wll === undefined) noDefault(`manila rope "${input.diameter}"`);
    return { wllLb: wll!, source: `${SOURCES.cfr393_108} table (${FIRST_PUBLISHED})`, note: 'unmarked manila rope by its diameter (49 CFR 393.108(f))' };
  }
  if (input.kind === 'synthetic-rope') {
    const fiber: SyntheticRopeFiber = input.fiber ?? 'polypropylene';
    if (fiber === 'double-braided-nylon') noDefault(`double braided nylon rope "${input.diameter}"`);
    const table = SYNTHETIC_ROPE_WLL[fiber as Exclude<SyntheticRopeFiber, 'double-braided-nylon'>];
    if (!table) throw new RangeError(`fiber must be 'polypropylene', 'polyester', 'nylon' or 'double-braided-nylon'; got ${String(input.fiber)}`);
    const wll = table[sizeKey(input.diameter)];
    if (wll === undefined) noDefault(`${fiber} rope "${input.diameter}"`);
    return {
      wllLb: wll!,
      source: `${SOURCES.cfr393_108} table (${FIRST_PUBLISHED})`,
      note: input.fiber === undefined ? 'synthetic cordage of unknown fiber counts as polypropylene (49 CFR 393.108(c))' : undefined,
    };
  }
  throw new RangeError(
    `kind must be 'chain', 'webbing', 'wire-rope', 'manila-rope' or 'synthetic-rope'; got ${String((input as { kind?: unknown }).kind)}`,
  );
}

export type TiedownSpec = {
  label?: string;
  wllLb: number;
  anchorWllLb?: number;
  /** Where the tiedown is anchored, e.g. 'stake pocket', 'winch track' (for the explanation). */
  anchorKind?: string;
  path: TiedownPath;
  edgeProtection?: boolean;
};

export type SecurementInput = {
  weightLb: number;
  lengthFt: number;
  blockedForward: boolean;
  /** Vehicles, equipment and machinery (393.130 applies over 10,000 lb). */
  heavyEquipment?: boolean;
  /** The article has edges that would abrade or cut a tiedown. */
  sharpEdges?: boolean;
  tiedowns: TiedownSpec[];
};

export type SecurementResult = {
  requiredCount: number;
  count: number;
  requiredAggregateLb: number;
  aggregateLb: number;
  ok: boolean;
  findings: string[];
  reasons: Reason[];
  /** Credited WLL per tiedown, in input order. */
  credited: number[];
  caution: string;
};

/** 393.106 (aggregate WLL ≥ half the weight), 393.110 (count), 393.130 (heavy equipment), edge protection. */
export function checkSecurement(input: SecurementInput): SecurementResult {
  const weight = checkNumber('weightLb', input.weightLb, { min: 0, minExclusive: true, max: ABSURD.weightLb, unit: 'lb' });
  if (!Array.isArray(input.tiedowns)) throw new RangeError('tiedowns must be an array');
  const findings: string[] = [];
  const reasons: Reason[] = [];
  let ok = true;
  const fail = (msg: string, reason: Omit<Reason, 'message'>): void => {
    ok = false;
    findings.push(msg);
    reasons.push({ ...reason, message: msg });
  };

  const baseCount = minimumTiedowns(input);
  const heavy = input.heavyEquipment === true && weight > 10_000;
  const requiredCount = heavy ? Math.max(4, baseCount) : baseCount;
  reasons.push({
    code: 'tiedown-count',
    message: `${input.lengthFt} ft, ${formatPounds(weight)}, ${input.blockedForward ? 'blocked' : 'not blocked'} forward: at least ${baseCount} tiedown${
      baseCount === 1 ? '' : 's'
    }`,
    value: baseCount,
    unit: 'count',
    source: SOURCES.cfr393_110,
  });
  if (heavy) {
    reasons.push({
      code: 'heavy-equipment',
      message: `equipment over 10,000 lb: at least four tiedowns, each rated at least 5,000 lb; lower accessories and restrain articulation`,
      limit: 4,
      unit: 'count',
      source: SOURCES.cfr393_130,
    });
    findings.push('lower and secure accessories (blades, buckets, booms) and restrain articulation (49 CFR 393.130)');
  }

  const credited = input.tiedowns.map((t, i) => {
    const c = creditedWll({ wllLb: t.wllLb, anchorWllLb: t.anchorWllLb, path: t.path });
    if (t.anchorWllLb !== undefined && t.anchorWllLb < t.wllLb) {
      reasons.push({
        code: 'anchor-governs',
        message: `${t.label ?? `tiedown ${i + 1}`}: rated at its ${t.anchorKind ?? 'anchor point'} (${formatPounds(t.anchorWllLb)}), lower than its own ${formatPounds(t.wllLb)}`,
        value: t.anchorWllLb,
        unit: 'lb',
        source: `${SOURCES.cfr393_108}(a)`,
      });
    }
    return c;
  });
  const aggregateLb = credited.reduce((s, c) => s + c, 0);
  const requiredAggregateLb = weight / 2;
  const count = input.tiedowns.length;

  if (count < requiredCount) {
    fail(`${count} tiedown${count === 1 ? '' : 's'}; at least ${requiredCount} required`, {
      code: 'too-few-tiedowns',
      value: count,
      limit: requiredCount,
      unit: 'count',
      source: heavy ? `${SOURCES.cfr393_110}; ${SOURCES.cfr393_130}` : SOURCES.cfr393_110,
    });
  }
  if (aggregateLb + EPS < requiredAggregateLb) {
    fail(`aggregate credited WLL ${formatPounds(aggregateLb)} is below half the weight, ${formatPounds(requiredAggregateLb)}`, {
      code: 'aggregate-wll-low',
      value: aggregateLb,
      limit: requiredAggregateLb,
      unit: 'lb',
      source: SOURCES.cfr393_106,
    });
  } else {
    reasons.push({
      code: 'aggregate-wll',
      message: `aggregate credited WLL ${formatPounds(aggregateLb)} ≥ half the weight, ${formatPounds(requiredAggregateLb)}`,
      value: aggregateLb,
      limit: requiredAggregateLb,
      unit: 'lb',
      source: SOURCES.cfr393_106,
    });
  }
  if (heavy) {
    input.tiedowns.forEach((t, i) => {
      const rated = Math.min(t.wllLb, t.anchorWllLb ?? Infinity);
      if (rated < 5_000) {
        fail(`${t.label ?? `tiedown ${i + 1}`} is rated ${formatPounds(rated)}; equipment over 10,000 lb needs each tiedown rated at least 5,000 lb`, {
          code: 'heavy-equipment-tiedown-wll',
          value: rated,
          limit: 5_000,
          unit: 'lb',
          source: SOURCES.cfr393_130,
        });
      }
    });
  }
  if (input.sharpEdges) {
    const bare = input.tiedowns.filter((t) => !t.edgeProtection).length;
    const msg =
      bare > 0
        ? `use edge protection where a tiedown touches a sharp edge (${bare} tiedown${bare === 1 ? '' : 's'} without it)`
        : 'edge protection noted on every tiedown: check it stays in place';
    findings.push(msg);
    reasons.push({ code: 'edge-protection', message: msg, source: SOURCES.edge });
  }
  return { requiredCount, count, requiredAggregateLb, aggregateLb, ok, findings, reasons, credited, caution: PLANNING_CAUTION };
}

/** 49 CFR 393.102 performance criteria (fractions of g; downward force as a fraction of the article's weight). */
export const SECUREMENT_PERFORMANCE = {
  breakingStrength: { forward: 0.8, rearward: 0.5, lateral: 0.5 },
  workingLoadLimit: { forward: 0.435, rearward: 0.5, lateral: 0.25 },
  downwardFractionIfNotContained: 0.2,
  source: SOURCES.cfr393_102,
} as const;

/**
 * Typical anchor-point ratings on an open-deck trailer, for fleet defaults when the trailer's own ratings are not
 * on file (common practice, no published source). A tiedown anchored there is credited at most this rating.
 */
export const TYPICAL_ANCHOR_WLL = {
  slidingWinch: 6_600,
  pipeSpool: 6_600,
  stakePocket: 5_000,
  source: SOURCES.practice,
} as const;
