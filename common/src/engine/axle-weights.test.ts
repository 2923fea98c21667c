import { checkAxleWeights } from './axle-weights';

const axlesAt = (positions: number[], weights: number[]) => positions.map((positionFt, i) => ({ positionFt, weightLb: weights[i] }));

describe('checkAxleWeights', () => {
  it('references §1 worked vehicle [D from 23 U.S.C. 127]: 16/4/31/4 ft, 12,000 + 4 × 17,000 → legal at 80,000', () => {
    const r = checkAxleWeights(axlesAt([0, 16, 20, 51, 55], [12_000, 17_000, 17_000, 17_000, 17_000]));
    expect(r.legal).toBe(true);
    expect(r.grossLb).toBe(80_000);
    expect(r.violations).toEqual([]);
    // 5 singles + C(5,2) groups (10) + gross.
    expect(r.groups).toHaveLength(16);
    const g = (from: number, to: number, rule?: string) => r.groups.find((x) => x.fromAxle === from && x.toAxle === to && (!rule || x.rule === rule))!;
    expect(g(2, 3).rule).toBe('tandem');
    expect(g(2, 3).limitLb).toBe(34_000);
    expect(g(2, 5).limitLb).toBe(68_000); // L = 39, N = 4 → 68,000
    expect(g(1, 5, 'bridge-formula').limitLb).toBe(82_500);
    expect(g(1, 5, 'gross').limitLb).toBe(80_000);
    expect(r.caution).toMatch(/certified scale/);
  });

  // FHWA Q&A on 23 CFR 658.17: single ≤ 40 in; tandem > 40 in and ≤ 96 in.
  it.each([
    [40, 'single', 20_000, 1],
    [40.0001, 'tandem', 34_000, 2],
    [96, 'tandem', 34_000, 2],
    [97, 'bridge-formula', 38_000, 2], // 8'1" → Iowa Code 321.463 row: 38,000
  ])('FHWA Q&A on 23 CFR 658.17: two axles %f in apart are checked as %s (%i lb)', (inches, rule, limit, units) => {
    const r = checkAxleWeights(axlesAt([0, inches / 12], [10_000, 10_000]));
    const pair = r.groups.find((g) => g.fromAxle === 1 && g.toAxle === 2)!;
    expect(pair.rule).toBe(rule);
    expect(pair.limitLb).toBe(limit);
    expect(r.groups.filter((g) => g.rule === 'single')).toHaveLength(units);
  });

  it('23 U.S.C. 127: two axles within 40 in are one single axle: 21,000 on it is over 20,000', () => {
    const r = checkAxleWeights(axlesAt([0, 3], [10_500, 10_500]));
    expect(r.legal).toBe(false);
    expect(r.violations[0]).toMatchObject({ rule: 'single', weightLb: 21_000, limitLb: 20_000, overByLb: 1_000 });
  });

  it('23 U.S.C. 127: a tandem at 34,500 is over by 500 and says so', () => {
    const r = checkAxleWeights(axlesAt([0, 4.25], [17_250, 17_250]));
    expect(r.violations).toHaveLength(1);
    expect(r.violations[0].message).toMatch(/over by 500 lb/);
    expect(r.reasons[0].source).toMatch(/23 U.S.C. 127/);
  });

  // 23 U.S.C. 127(a): two consecutive tandems may carry 34,000 each at 36 ft or more.
  it.each([
    [36, 'two-tandem-exception', 68_000, true],
    [35.99, 'bridge-formula', 66_000, false], // L rounds to 36 ft, but the exception needs ≥ 36 ft measured
    [35, 'bridge-formula', 65_500, false],
    [39, 'bridge-formula', 68_000, true],
  ])('23 U.S.C. 127(a): tandems %f ft apart (extreme axles) → %s %i', (span, rule, limit, legal) => {
    const r = checkAxleWeights(axlesAt([0, 4, span - 4, span], [17_000, 17_000, 17_000, 17_000]));
    const g = r.groups.find((x) => x.fromAxle === 1 && x.toAxle === 4 && x.rule !== 'gross')!;
    expect(g.rule).toBe(rule);
    expect(g.limitLb).toBe(limit);
    expect(r.legal).toBe(legal);
  });

  it('23 U.S.C. 127: gross over 80,000 is a violation even when every group passes', () => {
    const r = checkAxleWeights(axlesAt([0, 16, 20, 51, 55], [12_000, 17_000, 17_000, 17_000, 17_500]));
    expect(r.legal).toBe(false);
    expect(r.violations.map((v) => v.rule)).toEqual(expect.arrayContaining(['gross']));
  });

  it('limits are overridable per jurisdiction (permit maximums, no bridge formula)', () => {
    const r = checkAxleWeights(axlesAt([0, 16, 20.5, 40, 44.5], [12_000, 22_000, 22_000, 22_000, 22_000]), {
      singleAxleLb: 25_000,
      tandemLb: 46_000,
      grossLb: 120_000,
      bridgeFormula: false,
      source: 'sample permit limits',
    });
    expect(r.legal).toBe(true);
    expect(r.groups.some((g) => g.rule === 'bridge-formula')).toBe(false);
  });

  it('9-axle combination: every group of consecutive axles is checked', () => {
    const r = checkAxleWeights(axlesAt([0, 17, 21.5, 26, 36, 40.5, 45, 49.5, 54], Array(9).fill(10_000)));
    const multi = r.groups.filter((g) => g.rule !== 'single' && g.rule !== 'gross');
    expect(multi).toHaveLength(36);
  });

  it.each([
    [[], /at least one axle/],
    [[{ positionFt: 0, weightLb: -1 }], /axles\[0\].weightLb must be at least 0/],
    [[{ positionFt: 0, weightLb: Number.NaN }], /axles\[0\].weightLb must be a finite number/],
    [[{ positionFt: 10, weightLb: 1 }, { positionFt: 5, weightLb: 1 }], /axles\[1\].positionFt must not be ahead/],
    [[{ positionFt: 0, weightLb: 5_000_000 }], /absurd/],
  ])('bad input → RangeError (%#)', (axles, msg) => {
    expect(() => checkAxleWeights(axles as never)).toThrow(RangeError);
    expect(() => checkAxleWeights(axles as never)).toThrow(msg);
  });
});
