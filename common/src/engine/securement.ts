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

export type DefaultWllInput =
  /** Chain by nominal size (e.g. '3/8') and grade; an unmarked chain counts as grade 30 (393.108(d)). */
  | { kind: 'chain'; size: string; grade?: ChainGrade }
  /** Synthetic webbing by width (e.g. '2', '1 3/4'). */
  | { kind: 'webbing'; width: string };

/** The cells of the 393.108 default table held here (read in the regulation; see references). */
const CHAIN_WLL: Record<string, Partial<Record<ChainGrade, number>>> = {
  '5/16': { 70: 4_700, 80: 4_500 },
  '3/8': { 30: 2_650, 43: 5_400, 70: 6_600, 80: 7_100, 100: 8_800 },
  '1/2': { 70: 11_300 },
};
const WEBBING_WLL: Record<string, number> = { '1 3/4': 1_750, '2': 2_000, '3': 3_000, '4': 4_000 };

/**
 * Default working load limit from the 49 CFR 393.108 tables. Only the table cells this package holds are
 * answered; any other size/grade throws a RangeError asking for the marked WLL (393.108(b): marked values
 * override the table).
 */
export function defaultWll(input: DefaultWllInput): { wllLb: number; source: string; note?: string } {
  if (input.kind === 'chain') {
    const grade: ChainGrade = input.grade ?? 30;
    const row = CHAIN_WLL[String(input.size).trim()];
    const wll = row?.[grade];
    if (wll === undefined) {
      throw new RangeError(
        `chain size "${input.size}" grade ${grade}: no default WLL on file; use the WLL marked on the chain (49 CFR 393.108(b))`,
      );
    }
    return {
      wllLb: wll,
      source: `${SOURCES.cfr393_108} table`,
      note: input.grade === undefined ? 'unmarked chain counts as grade 30 (49 CFR 393.108(d))' : undefined,
    };
  }
  if (input.kind === 'webbing') {
    const wll = WEBBING_WLL[String(input.width).trim()];
    if (wll === undefined) {
      throw new RangeError(`webbing width "${input.width}" in: no default WLL on file; use the marked WLL (49 CFR 393.108(b))`);
    }
    return { wllLb: wll, source: `${SOURCES.cfr393_108} table` };
  }
  throw new RangeError(`kind must be 'chain' or 'webbing'; got ${String((input as { kind?: unknown }).kind)}`);
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
