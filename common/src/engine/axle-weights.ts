/** Axle weight check: single, tandem, gross and the bridge formula on every group of consecutive axles. */
import { bridgeFormulaWeight, roundToNearestFoot } from './bridge-formula';
import { PLANNING_CAUTION, Reason, SOURCES } from './reasons';
import { formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

export type AxleInput = {
  /** Feet from the front (steer) axle. */
  positionFt: number;
  weightLb: number;
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

export type AxleCheckResult = {
  legal: boolean;
  grossLb: number;
  groups: AxleGroupCheck[];
  violations: AxleGroupCheck[];
  reasons: Reason[];
  caution: string;
};

const SINGLE_MAX_IN = 40;
const TANDEM_MAX_IN = 96;
const EPS = 1e-6;

type Unit = { first: number; last: number; weightLb: number };

/**
 * Checks axle weights. Axles not more than 40 in apart count as one single axle; a run of consecutive axles
 * spread over more than 40 in and not more than 96 in is a tandem; wider groups take the bridge formula,
 * with the two-tandem exception at 36 ft or more; the gross is checked against its own limit.
 */
export function checkAxleWeights(axles: AxleInput[], limits: Partial<AxleLimits> = {}): AxleCheckResult {
  const lim: AxleLimits = { ...FEDERAL_AXLE_LIMITS, ...limits };
  if (!Array.isArray(axles) || axles.length === 0) throw new RangeError('axles must list at least one axle');
  if (axles.length > 40) throw new RangeError(`axles: at most 40 axles (absurd value); got ${axles.length}`);
  const pos: number[] = [];
  const wt: number[] = [];
  for (let i = 0; i < axles.length; i++) {
    const a = axles[i];
    pos.push(checkNumber(`axles[${i}].positionFt`, a.positionFt, { min: 0, max: ABSURD.lengthFt, unit: 'ft' }));
    wt.push(checkNumber(`axles[${i}].weightLb`, a.weightLb, { min: 0, max: ABSURD.axleWeightLb, unit: 'lb' }));
    if (i > 0 && pos[i] < pos[i - 1]) {
      throw new RangeError(`axles[${i}].positionFt must not be ahead of axle ${i} (positions run front to rear)`);
    }
  }
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
    push(u.first + 1, u.last + 1, u.last - u.first + 1, pos[u.last] - pos[u.first], u.weightLb, lim.singleAxleLb, 'single', srcUnit, 'single axle');
  }

  // Groups of two or more consecutive units.
  const spanIn = (a: number, b: number): number => (pos[units[b].last] - pos[units[a].first]) * 12;
  for (let i = 0; i < units.length; i++) {
    let weight = units[i].weightLb;
    for (let j = i + 1; j < units.length; j++) {
      weight += units[j].weightLb;
      const span = spanIn(i, j);
      const distanceFt = span / 12;
      const fromAxle = units[i].first + 1;
      const toAxle = units[j].last + 1;
      const axleCount = units[j].last - units[i].first + 1;
      if (span <= TANDEM_MAX_IN + EPS) {
        push(fromAxle, toAxle, axleCount, distanceFt, weight, lim.tandemLb, 'tandem', srcUnit, 'tandem');
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
  push(1, pos.length, pos.length, pos[pos.length - 1] - pos[0], grossLb, lim.grossLb, 'gross', src, 'gross');

  const violations = groups.filter((g) => !g.ok);
  const reasons: Reason[] = violations.map((g) => ({
    code: `axle-${g.rule}`,
    message: g.message,
    value: g.weightLb,
    limit: g.limitLb,
    unit: 'lb',
    source: g.source,
  }));
  if (violations.length === 0) {
    reasons.push({
      code: 'axles-within-limits',
      message: `every axle, group and the gross (${formatPounds(grossLb)}) are within their limits`,
      value: grossLb,
      limit: lim.grossLb,
      unit: 'lb',
      source: src,
    });
  }
  return { legal: violations.length === 0, grossLb, groups, violations, reasons, caution: PLANNING_CAUTION };
}

const round1 = (n: number): number => Math.round(n * 10) / 10;
