/**
 * Axle weight check: single, tandem, gross and the bridge formula on every group of consecutive axles; where the
 * limits give them, tridem and quad group limits, per-inch-of-tire-width and per-tire limits and each tire's rating.
 */
import { bridgeFormulaWeight, roundToNearestFoot } from './bridge-formula';
import { BridgeRule, Fact, JurisdictionRule, PermitMaxima, cite, isKnown } from './jurisdiction-rule';
import { PLANNING_CAUTION, Reason, SOURCES } from './reasons';
import { parseTireSize } from './tire-size';
import { formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

/** The tires on one axle. */
export type AxleTires = {
  /** Size notation, e.g. '11R22.5', '425/65R22.5', '275/80R22.5'. */
  size: string;
  /** Tires on the axle: 2 for singles, 4 for duals. */
  count: number;
  /** Each tire's load rating for its mounting (single or dual), lb, as molded in the sidewall. */
  ratingLb?: number;
};

export type AxleInput = {
  /** Feet from the front (steer) axle. */
  positionFt: number;
  weightLb: number;
  /** The axle group it belongs to (e.g. 'drive', 'trailer-1'); axles with one key are checked as one group. */
  group?: string;
  /** A lift axle that is up: it carries nothing and drops out of every group's count and spread. */
  lifted?: boolean;
  /** A steering axle (per-inch-of-tire-width rules often treat it apart). */
  steer?: boolean;
  tires?: AxleTires;
};

/** Limits for the check; federal by default, overridable per jurisdiction (legal or permit maximums). */
export type AxleLimits = {
  singleAxleLb: number;
  tandemLb: number;
  grossLb: number;
  /** Apply the bridge formula to every group of two or more consecutive axles spread over 96 in. */
  bridgeFormula: boolean;
  /** Two consecutive tandems may carry tandemLb each when their extreme axles are at least `tandemPairMinFt` apart. */
  tandemPairMinFt: number | null;
  /** Tie rule of the bridge table (`down` federal, `up` e.g. 67 Pa. Code 185.3). */
  bridgeTie: 'down' | 'up';
  source: string;
  /**
   * Three-axle group limit where the jurisdiction sets one (none federally: the bridge formula governs). When set, a
   * group of three axles is checked against it instead of the tandem limit.
   */
  tridemLb?: number | null;
  /** Four-axle group limit where the jurisdiction sets one (e.g. a permit's quad maximum). */
  quadLb?: number | null;
  /** Pounds per inch of nominal tire section width, on the sum of the axle's tire widths. */
  tireLbPerInch?: number | null;
  /**
   * Whether `tireLbPerInch` applies to steering axles too. Default false: several texts treat steering axles apart
   * (Cal. Veh. Code 35550(c)(2) excepts them; Minn. Stat. 169.823 and the WYDOT permit page give them another figure).
   */
  tireLbPerInchOnSteer?: boolean;
  /** Pounds per inch of tire width on steering axles, where the text gives its own figure. */
  steerTireLbPerInch?: number | null;
  /** Pounds per tire, where the text sets a per-tire (per-wheel) maximum. */
  tireLbPerTire?: number | null;
  /** Check each axle against its tires' sidewall ratings (default true when the rating is given). */
  tireRatings?: boolean;
};

export const FEDERAL_AXLE_LIMITS: AxleLimits = {
  singleAxleLb: 20_000,
  tandemLb: 34_000,
  grossLb: 80_000,
  bridgeFormula: true,
  tandemPairMinFt: 36,
  bridgeTie: 'down',
  source: SOURCES.usc127,
};

export type AxleGroupRule = 'single' | 'tandem' | 'bridge-formula' | 'two-tandem-exception' | 'gross';

export type AxleGroupCheck = {
  /** 1-based axle numbers, front to rear. */
  fromAxle: number;
  toAxle: number;
  axleCount: number;
  /** Distance between the group's extreme axles (as measured). */
  distanceFt: number;
  weightLb: number;
  limitLb: number;
  rule: AxleGroupRule;
  ok: boolean;
  overByLb: number;
  message: string;
  source: string;
};

/** A group-limit or tire check beyond the single/tandem/bridge/gross checks of `groups`. */
export type AxleFindingRule = 'tridem' | 'quad' | 'tire-width' | 'tire-per-tire' | 'tire-rating';

export type AxleFinding = {
  rule: AxleFindingRule;
  /** 1-based axle numbers of the input, front to rear. */
  axles: number[];
  group?: string;
  weightLb: number;
  limitLb: number;
  ok: boolean;
  overByLb: number;
  message: string;
  source: string;
};

/** An axle group as checked: named by the input's `group` keys, or runs of axles each within 96 in of the next. */
export type CheckedAxleGroup = {
  key: string;
  /** 1-based input numbers of the axles that are down. */
  axles: number[];
  /** Axles down (lift axles that are up do not count). */
  axleCount: number;
  liftedCount: number;
  spreadFt: number;
  weightLb: number;
};

export type AxleCheckResult = {
  legal: boolean;
  grossLb: number;
  groups: AxleGroupCheck[];
  violations: AxleGroupCheck[];
  /** The combination's axle groups (lift axles that are up left out of counts and spreads). */
  axleGroups: CheckedAxleGroup[];
  /** Tridem / quad group limits and tire checks, where the limits or the axles give them. */
  findings: AxleFinding[];
  /** The findings over their limit. */
  findingViolations: AxleFinding[];
  reasons: Reason[];
  caution: string;
};

/** 49 CFR 393.75(f): no tire carries more than the load marked on its sidewall (FMCSA guidance: a state permit may allow more at reduced speed). */
export const TIRE_RATING_SOURCE = '49 CFR 393.75(f) (load marked on the sidewall; a state permit may allow more at reduced speed, FMCSA guidance)';

const SINGLE_MAX_IN = 40;
const TANDEM_MAX_IN = 96;
const EPS = 1e-6;

type Unit = { first: number; last: number; weightLb: number };

/** The limit a group of `axleCount` axles spread `spreadFt` takes, by its count and spread. */
export type GroupLimit = {
  limitLb: number | null;
  rule: 'single' | 'tandem' | 'tridem' | 'quad' | 'bridge-formula' | 'none';
  source: string;
  words: string;
};

/**
 * The limit of one axle group by its axle count and spread: within 40 in one single axle; over 40 in and up to 96 in
 * a tandem (FHWA Q&A on 23 CFR 658.17); wider, the bridge formula (23 U.S.C. 127) for its count and spread. A
 * jurisdiction's tridem or quad figure, where given, is the limit of a three- or four-axle group (the lower of it
 * and the bridge formula when that applies).
 */
export function groupLimit(axleCount: number, spreadFt: number, limits: Partial<AxleLimits> = {}): GroupLimit {
  const lim: AxleLimits = { ...FEDERAL_AXLE_LIMITS, ...limits };
  checkNumber('axleCount', axleCount, { min: 0, max: 40, integer: true });
  checkNumber('spreadFt', spreadFt, { min: 0, max: ABSURD.lengthFt, unit: 'ft' });
  const srcUnit = `${lim.source}; ${SOURCES.cfr658_5}`;
  if (axleCount === 0) return { limitLb: null, rule: 'none', source: lim.source, words: 'no axle down' };
  const spanIn = spreadFt * 12;
  const special = axleCount === 3 ? lim.tridemLb : axleCount === 4 ? lim.quadLb : null;
  const specialRule = axleCount === 3 ? 'tridem' : 'quad';
  if (spanIn <= SINGLE_MAX_IN + EPS && axleCount >= 1) {
    if (special != null && axleCount > 1) return { limitLb: special, rule: specialRule, source: lim.source, words: `${specialRule} group` };
    return { limitLb: lim.singleAxleLb, rule: 'single', source: srcUnit, words: axleCount === 1 ? 'single axle' : `${axleCount} axles within 40 in (one single axle)` };
  }
  if (special != null) {
    let limitLb = special;
    if (lim.bridgeFormula && spanIn > TANDEM_MAX_IN + EPS) limitLb = Math.min(limitLb, bridgeFormulaWeight(spreadFt, axleCount, { tie: lim.bridgeTie }));
    return { limitLb, rule: limitLb === special ? specialRule : 'bridge-formula', source: lim.source, words: `${specialRule} group, ${round1(spreadFt)} ft spread` };
  }
  if (spanIn <= TANDEM_MAX_IN + EPS) return { limitLb: lim.tandemLb, rule: 'tandem', source: srcUnit, words: `tandem (${axleCount} axles, ${round1(spreadFt)} ft spread)` };
  if (!lim.bridgeFormula) return { limitLb: null, rule: 'none', source: lim.source, words: `${axleCount} axles spread ${round1(spreadFt)} ft: no group limit set` };
  return {
    limitLb: bridgeFormulaWeight(spreadFt, axleCount, { tie: lim.bridgeTie }),
    rule: 'bridge-formula',
    source: `${lim.source}; ${SOURCES.bridgeTable}`,
    words: `bridge formula, L = ${roundToNearestFoot(spreadFt)} ft, N = ${axleCount}`,
  };
}

/**
 * Checks axle weights. Axles not more than 40 in apart count as one single axle; a run of consecutive axles
 * spread over more than 40 in and not more than 96 in is a tandem; wider groups take the bridge formula,
 * with the two-tandem exception at 36 ft or more; the gross is checked against its own limit. Lift axles that are
 * up (`lifted`) carry nothing and drop out of every count and spread; axle numbers stay those of the input.
 * Where the limits give them: tridem and quad group limits on the combination's groups, pounds per inch of tire
 * width and per tire, and each tire's own rating.
 */
export function checkAxleWeights(axles: AxleInput[], limits: Partial<AxleLimits> = {}): AxleCheckResult {
  const lim: AxleLimits = { ...FEDERAL_AXLE_LIMITS, ...limits };
  if (!Array.isArray(axles) || axles.length === 0) throw new RangeError('axles must list at least one axle');
  if (axles.length > 40) throw new RangeError(`axles: at most 40 axles (absurd value); got ${axles.length}`);
  const allPos: number[] = [];
  for (let i = 0; i < axles.length; i++) {
    const a = axles[i];
    allPos.push(checkNumber(`axles[${i}].positionFt`, a.positionFt, { min: 0, max: ABSURD.lengthFt, unit: 'ft' }));
    checkNumber(`axles[${i}].weightLb`, a.weightLb, { min: 0, max: ABSURD.axleWeightLb, unit: 'lb' });
    if (i > 0 && allPos[i] < allPos[i - 1]) {
      throw new RangeError(`axles[${i}].positionFt must not be ahead of axle ${i} (positions run front to rear)`);
    }
    if (a.lifted && a.weightLb > EPS) throw new RangeError(`axles[${i}] is a lift axle that is up: it carries nothing (weightLb must be 0)`);
  }
  // The axles that are down, with their input numbers.
  const down = axles.map((a, i) => i).filter((i) => !axles[i].lifted);
  if (down.length === 0) throw new RangeError('axles: at least one axle must be down');
  const pos = down.map((i) => allPos[i]);
  const wt = down.map((i) => axles[i].weightLb);
  const num = (k: number): number => down[k] + 1;

  // The combination's groups: named by `group`, else runs of down axles each within 96 in of the next ([D] from the
  // FHWA tandem definition).
  const axleGroups: CheckedAxleGroup[] = [];
  const named = axles.some((a) => a.group !== undefined);
  if (named) {
    const order: string[] = [];
    const byKey = new Map<string, number[]>();
    axles.forEach((a, i) => {
      const key = a.group ?? `axle-${i + 1}`;
      if (!byKey.has(key)) {
        byKey.set(key, []);
        order.push(key);
      }
      byKey.get(key)!.push(i);
    });
    for (const key of order) {
      const members = byKey.get(key)!;
      const dn = members.filter((i) => !axles[i].lifted);
      axleGroups.push({
        key,
        axles: dn.map((i) => i + 1),
        axleCount: dn.length,
        liftedCount: members.length - dn.length,
        spreadFt: dn.length > 1 ? allPos[dn[dn.length - 1]] - allPos[dn[0]] : 0,
        weightLb: dn.reduce((s, i) => s + axles[i].weightLb, 0),
      });
    }
  } else {
    let run: number[] = [];
    const flush = (): void => {
      if (run.length === 0) return;
      axleGroups.push({
        key: `axles-${run[0] + 1}-${run[run.length - 1] + 1}`,
        axles: run.map((i) => i + 1),
        axleCount: run.length,
        liftedCount: 0,
        spreadFt: allPos[run[run.length - 1]] - allPos[run[0]],
        weightLb: run.reduce((s, i) => s + axles[i].weightLb, 0),
      });
      run = [];
    };
    for (const i of down) {
      if (run.length > 0 && (allPos[i] - allPos[run[run.length - 1]]) * 12 > TANDEM_MAX_IN + EPS) flush();
      run.push(i);
    }
    flush();
  }
  // Groups a jurisdiction's tridem / quad figure governs instead of the tandem limit.
  const specialGroups = axleGroups.filter((g) => (g.axleCount === 3 && lim.tridemLb != null) || (g.axleCount === 4 && lim.quadLb != null));
  const isSpecialRun = (fromNum: number, toNum: number): boolean =>
    specialGroups.some((g) => g.axles[0] === fromNum && g.axles[g.axles.length - 1] === toNum);

  const src = lim.source;
  const srcUnit = `${src}; ${SOURCES.cfr658_5}`;
  const srcBridge = `${src}; ${SOURCES.bridgeTable}`;
  const groups: AxleGroupCheck[] = [];
  const push = (
    fromAxle: number,
    toAxle: number,
    axleCount: number,
    distanceFt: number,
    weightLb: number,
    limitLb: number,
    rule: AxleGroupRule,
    source: string,
    what: string,
  ): void => {
    const over = weightLb > limitLb ? weightLb - limitLb : 0;
    const ok = over <= EPS;
    const span = fromAxle === toAxle ? `axle ${fromAxle}` : `axles ${fromAxle}–${toAxle}`;
    const message = `${span} (${what}): ${formatPounds(weightLb)} against ${formatPounds(limitLb)}${ok ? '' : `, over by ${formatPounds(over)}`}`;
    groups.push({ fromAxle, toAxle, axleCount, distanceFt, weightLb, limitLb, rule, ok, overByLb: over, message, source });
  };

  // Single-axle units: consecutive axles whose extreme centers are within 40 in.
  const units: Unit[] = [];
  for (let i = 0; i < pos.length; i++) {
    const u = units[units.length - 1];
    if (u && (pos[i] - pos[u.first]) * 12 <= SINGLE_MAX_IN + EPS) {
      u.last = i;
      u.weightLb += wt[i];
    } else {
      units.push({ first: i, last: i, weightLb: wt[i] });
    }
  }
  for (const u of units) {
    push(num(u.first), num(u.last), u.last - u.first + 1, pos[u.last] - pos[u.first], u.weightLb, lim.singleAxleLb, 'single', srcUnit, 'single axle');
  }

  // Groups of two or more consecutive units.
  const spanIn = (a: number, b: number): number => (pos[units[b].last] - pos[units[a].first]) * 12;
  for (let i = 0; i < units.length; i++) {
    let weight = units[i].weightLb;
    for (let j = i + 1; j < units.length; j++) {
      weight += units[j].weightLb;
      const span = spanIn(i, j);
      const distanceFt = span / 12;
      const fromAxle = num(units[i].first);
      const toAxle = num(units[j].last);
      const axleCount = units[j].last - units[i].first + 1;
      if (span <= TANDEM_MAX_IN + EPS) {
        if (!isSpecialRun(fromAxle, toAxle)) push(fromAxle, toAxle, axleCount, distanceFt, weight, lim.tandemLb, 'tandem', srcUnit, 'tandem');
        continue;
      }
      if (!lim.bridgeFormula) continue;
      const n = j - i + 1;
      const bridge = bridgeFormulaWeight(distanceFt, n, { tie: lim.bridgeTie });
      const L = roundToNearestFoot(distanceFt);
      let limitLb = bridge;
      let rule: AxleGroupRule = 'bridge-formula';
      if (lim.tandemPairMinFt !== null && distanceFt + EPS >= lim.tandemPairMinFt && n >= 4) {
        for (let k = i + 1; k <= j - 2; k++) {
          // Split into two tandems of at least two units each: i..k and k+1..j.
          const firstIsTandem = spanIn(i, k) <= TANDEM_MAX_IN + EPS;
          const secondIsTandem = spanIn(k + 1, j) <= TANDEM_MAX_IN + EPS;
          if (firstIsTandem && secondIsTandem && 2 * lim.tandemLb > bridge) {
            limitLb = 2 * lim.tandemLb;
            rule = 'two-tandem-exception';
            break;
          }
        }
      }
      push(
        fromAxle,
        toAxle,
        axleCount,
        distanceFt,
        weight,
        limitLb,
        rule,
        rule === 'bridge-formula' ? srcBridge : src,
        rule === 'bridge-formula'
          ? `bridge formula, L = ${L} ft, N = ${n}`
          : `two consecutive tandems ${round1(distanceFt)} ft apart (≥ ${lim.tandemPairMinFt} ft)`,
      );
    }
  }

  const grossLb = wt.reduce((s, w) => s + w, 0);
  push(num(0), num(pos.length - 1), pos.length, pos[pos.length - 1] - pos[0], grossLb, lim.grossLb, 'gross', src, 'gross');

  // Tridem / quad group limits and tire checks.
  const findings: AxleFinding[] = [];
  const find = (rule: AxleFindingRule, nums: number[], weightLb: number, limitLb: number, what: string, source: string, group?: string): void => {
    const over = weightLb > limitLb + EPS ? weightLb - limitLb : 0;
    const ok = over === 0;
    const span = nums.length === 1 ? `axle ${nums[0]}` : `axles ${nums[0]}–${nums[nums.length - 1]}`;
    const message = `${span} (${what}): ${formatPounds(weightLb)} against ${formatPounds(limitLb)}${ok ? '' : `, over by ${formatPounds(over)}`}`;
    findings.push({ rule, axles: nums, ...(group !== undefined ? { group } : {}), weightLb, limitLb, ok, overByLb: over, message, source });
  };
  for (const g of specialGroups) {
    const rule = g.axleCount === 3 ? 'tridem' : 'quad';
    const limitLb = (g.axleCount === 3 ? lim.tridemLb : lim.quadLb) as number;
    find(rule, g.axles, g.weightLb, limitLb, `${rule} group, ${round1(g.spreadFt)} ft spread`, src, g.key);
  }
  axles.forEach((a, i) => {
    if (a.lifted || !a.tires) return;
    const t = a.tires;
    const count = checkNumber(`axles[${i}].tires.count`, t.count, { min: 1, max: 16, integer: true });
    const size = parseTireSize(t.size);
    const perInch = a.steer ? (lim.steerTireLbPerInch ?? (lim.tireLbPerInchOnSteer ? lim.tireLbPerInch : null)) : lim.tireLbPerInch;
    if (perInch != null) {
      const widthIn = count * size.sectionWidthIn;
      find(
        'tire-width',
        [i + 1],
        a.weightLb,
        perInch * widthIn,
        `${formatPounds(perInch)} per inch of tire width × ${count} × ${round1(size.sectionWidthIn)} in (${size.size} nominal section width)`,
        src,
        a.group,
      );
    }
    if (lim.tireLbPerTire != null) find('tire-per-tire', [i + 1], a.weightLb, lim.tireLbPerTire * count, `${formatPounds(lim.tireLbPerTire)} per tire × ${count}`, src, a.group);
    if (t.ratingLb !== undefined && lim.tireRatings !== false) {
      const rating = checkNumber(`axles[${i}].tires.ratingLb`, t.ratingLb, { min: 0, minExclusive: true, max: 50_000, unit: 'lb' });
      find('tire-rating', [i + 1], a.weightLb, rating * count, `tire rating ${formatPounds(rating)} × ${count} (${size.size})`, TIRE_RATING_SOURCE, a.group);
    }
  });
  const findingViolations = findings.filter((f) => !f.ok);

  const violations = groups.filter((g) => !g.ok);
  const reasons: Reason[] = violations.map((g) => ({
    code: `axle-${g.rule}`,
    message: g.message,
    value: g.weightLb,
    limit: g.limitLb,
    unit: 'lb',
    source: g.source,
  }));
  for (const f of findingViolations) reasons.push({ code: `axle-${f.rule}`, message: f.message, value: f.weightLb, limit: f.limitLb, unit: 'lb', source: f.source });
  const legal = violations.length === 0 && findingViolations.length === 0;
  if (legal) {
    reasons.push({
      code: 'axles-within-limits',
      message: `every axle, group and the gross (${formatPounds(grossLb)}) are within their limits`,
      value: grossLb,
      limit: lim.grossLb,
      unit: 'lb',
      source: src,
    });
  }
  return { legal, grossLb, groups, violations, axleGroups, findings, findingViolations, reasons, caution: PLANNING_CAUTION };
}

const round1 = (n: number): number => Math.round(n * 10) / 10;

/** A jurisdiction's axle limits for `checkAxleWeights`, with what the record does not have on file. */
export type RuleAxleLimits = {
  limits: Partial<AxleLimits>;
  /** Limits not on file, in words (each then federal for a legal limit, or the legal one for a permit maximum). */
  notOnFile: string[];
};

/**
 * The limits of a rulebook record: `legal` — single, tandem, gross and the bridge rule (federal Interstate values
 * for any not on file, said so), the tridem figure and the per-inch-of-tire-width figure where on file; `permit` —
 * the routine permit maxima by group (single, tandem, tridem, quad, gross, per inch of tire width), the legal limit
 * for any maximum not on file (said so), and no bridge formula (whether a permit bridge table applies is not on file).
 */
export function axleLimitsFromRule(rule: JurisdictionRule, basis: 'legal' | 'permit' = 'legal'): RuleAxleLimits {
  const L = rule.legal;
  const notOnFile: string[] = [];
  const sources = new Set<string>();
  const take = <T>(what: string, f: Fact<T>, fallback: T): T => {
    if (isKnown(f)) {
      sources.add(cite(f));
      return f.value;
    }
    notOnFile.push(`legal ${what}`);
    return fallback;
  };
  const bridge = take<BridgeRule>('bridge formula', L.bridge, { formula: true, tandemPairMinFt: 36, tie: 'down' });
  const legal: Partial<AxleLimits> = {
    singleAxleLb: take('single axle', L.singleAxleLb, FEDERAL_AXLE_LIMITS.singleAxleLb),
    tandemLb: take('tandem', L.tandemLb, FEDERAL_AXLE_LIMITS.tandemLb),
    grossLb: take('gross', L.grossLb, FEDERAL_AXLE_LIMITS.grossLb),
    bridgeFormula: bridge.formula,
    tandemPairMinFt: bridge.tandemPairMinFt,
    bridgeTie: bridge.tie,
    tridemLb: take<number | null>('tridem', L.tridemLb, null),
    tireLbPerInch: take<number | null>('weight per inch of tire width', L.tireLbPerInch, null),
  };
  const federalNote = notOnFile.some((n) => /single|tandem|gross|bridge/.test(n)) ? [`${SOURCES.usc127} (federal Interstate limits where ${rule.name}'s own are not on file)`] : [];
  if (basis === 'legal') return { limits: { ...legal, source: [...sources, ...federalNote].join('; ') }, notOnFile };
  const m = rule.permit.routineMaxima;
  if (!isKnown(m)) {
    return { limits: { ...legal, source: [...sources, ...federalNote].join('; ') }, notOnFile: [...notOnFile, 'permit maxima (the legal limits are shown)'] };
  }
  const mx: PermitMaxima = m.value;
  const permitSource = cite(m);
  const pick = (what: string, v: number | undefined, fallback: number | null | undefined): number | null | undefined => {
    if (v !== undefined) return v;
    notOnFile.push(`permit ${what} maximum (the legal limit is shown)`);
    return fallback;
  };
  return {
    limits: {
      singleAxleLb: pick('single axle', mx.singleAxleLb, legal.singleAxleLb) as number,
      tandemLb: pick('tandem', mx.tandemLb, legal.tandemLb) as number,
      grossLb: pick('gross', mx.grossLb, legal.grossLb) as number,
      tridemLb: mx.tridemLb ?? legal.tridemLb ?? null,
      quadLb: mx.quadLb ?? null,
      tireLbPerInch: mx.tireLbPerInch ?? legal.tireLbPerInch ?? null,
      bridgeFormula: false,
      tandemPairMinFt: null,
      bridgeTie: legal.bridgeTie,
      source: [permitSource, ...sources].join('; '),
    },
    notOnFile: [...notOnFile, 'whether a permit bridge table applies'],
  };
}
