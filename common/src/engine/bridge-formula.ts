/** Federal bridge formula, 23 U.S.C. 127(a), rounded the way the published table does. */
import { checkNumber } from './validate';

export type BridgeFormulaOptions = {
  /**
   * How an exact tie (remainder 250 lb) is resolved. `down` is the federal table's convention (with its one
   * printed exception, 38 ft / 5 axles = 72,000 lb); `up` reproduces state variants such as 67 Pa. Code 185.3.
   */
  tie?: 'down' | 'up';
  /** Round L to the nearest foot first (W.Va. Code 17C-17-9, Fla. Stat. 316.535). Default true. */
  roundDistance?: boolean;
};

/**
 * Rounds a distance to the nearest foot. An exact half foot rounds down: the conservative choice
 * (the statutes say "to the nearest foot" without a tie rule; common practice, no published source).
 */
export function roundToNearestFoot(distanceFt: number): number {
  const lower = Math.floor(distanceFt);
  return distanceFt - lower > 0.5 + 1e-9 ? lower + 1 : lower;
}

/**
 * Permissible pounds on a group of `axleCount` consecutive axles whose extreme axles are `distanceFt` apart:
 * W = 500 (L·N/(N−1) + 12·N + 36), to the nearest 500 lb. Not capped at 80,000 lb (the gross limit is separate).
 */
export function bridgeFormulaWeight(distanceFt: number, axleCount: number, options: BridgeFormulaOptions = {}): number {
  checkNumber('distanceFt', distanceFt, { min: 0, minExclusive: true, max: 500, unit: 'ft' });
  checkNumber('axleCount', axleCount, { min: 2, max: 40, integer: true });
  const roundDistance = options.roundDistance ?? true;
  const L = roundDistance ? roundToNearestFoot(distanceFt) : distanceFt;
  if (L <= 0) throw new RangeError(`distanceFt must round to at least 1 ft; got ${distanceFt} ft`);
  const N = axleCount;
  const tie = options.tie ?? 'down';
  // Federal table's printed exception: 38 ft, 5 axles → 72,000 (the formula gives 71,750).
  if (tie === 'down' && L === 38 && N === 5) return 72_000;
  if (Number.isInteger(L)) {
    // Exact integer arithmetic: W = 500·(L·N + (12N + 36)(N − 1)) / (N − 1).
    const num = 500 * (L * N + (12 * N + 36) * (N - 1));
    const den = N - 1;
    const step = 500 * den;
    const base = Math.floor(num / step);
    const rem2 = 2 * (num - base * step);
    const up = rem2 > step || (rem2 === step && tie === 'up');
    return (base + (up ? 1 : 0)) * 500;
  }
  const raw = 500 * ((L * N) / (N - 1) + 12 * N + 36);
  const base = Math.floor(raw / 500);
  const rem = raw - base * 500;
  const isTie = Math.abs(rem - 250) < 1e-6;
  const up = isTie ? tie === 'up' : rem > 250;
  return (base + (up ? 1 : 0)) * 500;
}
