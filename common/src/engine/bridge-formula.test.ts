import { bridgeFormulaWeight, roundToNearestFoot } from './bridge-formula';

describe('bridgeFormulaWeight', () => {
  // N.C. Gen. Stat. 20-118 table (federal bridge formula table), references §1.
  it.each([
    [9, 2, 39_000],
    [10, 2, 40_000],
    [9, 3, 42_500],
    [12, 4, 50_000],
    [14, 4, 51_500],
    [20, 3, 51_000],
    [20, 4, 55_500],
    [20, 5, 60_500],
    [24, 7, 74_000],
    [32, 6, 73_000],
    [40, 5, 73_000],
    [48, 5, 78_000],
    [51, 5, 80_000],
    [57, 4, 80_000],
    [43, 6, 80_000],
  ])('N.C. Gen. Stat. 20-118 table: L = %i ft, N = %i → %i lb', (L, N, W) => {
    expect(bridgeFormulaWeight(L, N)).toBe(W);
  });

  // 250 lb ties: the published table resolves them downward (N.C. Gen. Stat. 20-118 table) ...
  it.each([
    [9, 3, 42_750, 42_500],
    [11, 3, 44_250, 44_000],
    [34, 5, 69_250, 69_000],
  ])('N.C. Gen. Stat. 20-118 table: tie at L = %i ft, N = %i (formula %i) rounds down to %i', (L, N, raw, W) => {
    expect(500 * ((L * N) / (N - 1) + 12 * N + 36)).toBeCloseTo(raw, 6);
    expect(bridgeFormulaWeight(L, N)).toBe(W);
  });

  it('N.C. Gen. Stat. 20-118 table: the one printed exception, 38 ft / 5 axles → 72,000 (formula 71,750)', () => {
    expect(bridgeFormulaWeight(38, 5)).toBe(72_000);
  });

  it.each([
    [9, 3, 43_000],
    [38, 5, 72_000],
    [34, 5, 69_500],
  ])('67 Pa. Code 185.3: state variant rounds ties up, L = %i ft, N = %i → %i', (L, N, W) => {
    expect(bridgeFormulaWeight(L, N, { tie: 'up' })).toBe(W);
  });

  it('Iowa Code 321.463 table row 8\'1": two axles 8 ft 1 in apart → 38,000', () => {
    expect(bridgeFormulaWeight(8 + 1 / 12, 2)).toBe(38_000);
  });

  // W.Va. Code 17C-17-9 / Fla. Stat. 316.535: L to the nearest foot; an exact half foot rounds down
  // (conservative; common practice, no published source).
  it.each([
    [20.4, 20],
    [20.5, 20],
    [20.51, 21],
    [19.6, 20],
  ])('W.Va. Code 17C-17-9: %f ft measures as %i ft', (ft, L) => {
    expect(roundToNearestFoot(ft)).toBe(L);
  });

  it('23 U.S.C. 127: no 80,000 cap inside the formula', () => {
    expect(bridgeFormulaWeight(60, 5)).toBe(500 * (75 + 96));
  });

  it.each([
    [0, 2, /distanceFt must be greater than 0/],
    [-5, 3, /distanceFt/],
    [Number.NaN, 3, /distanceFt must be a finite number/],
    [20, 1, /axleCount must be at least 2/],
    [20, 2.5, /axleCount must be a whole number/],
    [20, 100, /axleCount must be at most/],
    [5000, 3, /distanceFt must be at most 500/],
  ])('bad input (%p, %p) → RangeError', (L, N, msg) => {
    expect(() => bridgeFormulaWeight(L, N)).toThrow(RangeError);
    expect(() => bridgeFormulaWeight(L, N)).toThrow(msg);
  });
});
