import { axleLimitsFromRule, checkAxleWeights, groupLimit } from './axle-weights';
import { RULEBOOK_DATA } from '../rulebook/data-index';

const loadRule = (code: string) => RULEBOOK_DATA[code];

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

describe('groupLimit: a group by its axle count and spread', () => {
  // Bridge table cells, references §1 [V, N.C. Gen. Stat. 20-118 reproducing the federal table].
  it.each([
    [3, 9, 42_500, 'bridge-formula'],
    [3, 20, 51_000, 'bridge-formula'],
    [4, 12, 50_000, 'bridge-formula'],
    [4, 14, 51_500, 'bridge-formula'],
    [4, 20, 55_500, 'bridge-formula'],
    [4, 57, 80_000, 'bridge-formula'],
  ] as const)('federal bridge formula table: %i axles spread %i ft → %i lb', (n, spread, limit, rule) => {
    expect(groupLimit(n, spread)).toMatchObject({ limitLb: limit, rule });
  });

  it.each([
    [1, 0, 20_000, 'single', '23 U.S.C. 127: single axle'],
    [2, 4.5, 34_000, 'tandem', 'FHWA Q&A on 23 CFR 658.17: over 40 in and up to 96 in'],
    [3, 8, 34_000, 'tandem', 'FHWA Q&A on 23 CFR 658.17: three axles within 96 in are a tandem'],
  ] as const)('%i axles spread %f ft → %i (%s, %s)', (n, spread, limit, rule, _source) => {
    expect(groupLimit(n, spread)).toMatchObject({ limitLb: limit, rule });
  });

  it('TX record (TxDMV "Texas Size/Weight Limits": triple axle group 42,000 lb): the tridem figure governs a tridem', () => {
    // 9 ft tridem: the lower of 42,000 and the bridge table's 42,500 [D].
    expect(groupLimit(3, 9, { tridemLb: 42_000 })).toMatchObject({ limitLb: 42_000, rule: 'tridem' });
    // 8 ft tridem: 42,000 instead of the tandem limit.
    expect(groupLimit(3, 8, { tridemLb: 42_000 })).toMatchObject({ limitLb: 42_000, rule: 'tridem' });
  });

  it('LA record note (La. Admin. Code tit. 73, I-503: quadrum 50,000 lb, interstate): a quad figure governs a quad', () => {
    // 4 axles spread 14 ft: the lower of 50,000 and the bridge table's 51,500 [D]; spread 12 ft: bridge 50,000.
    expect(groupLimit(4, 14, { quadLb: 50_000 })).toMatchObject({ limitLb: 50_000, rule: 'quad' });
    // 10 ft quad: 23 U.S.C. 127 formula [D] 500 × (10 × 4 / 3 + 12 × 4 + 36) = 48,666.67 → 48,500, under the quad figure.
    expect(groupLimit(4, 10, { quadLb: 50_000 })).toMatchObject({ limitLb: 48_500, rule: 'bridge-formula' });
  });
});

describe('checkAxleWeights: lift axles, group and tire limits', () => {
  const tandem = (at: number, w: number, extra: object = {}) => [
    { positionFt: at - 2.25, weightLb: w / 2, ...extra },
    { positionFt: at + 2.25, weightLb: w / 2, ...extra },
  ];

  it('23 U.S.C. 127 with a lift axle up: it drops out of the counts and spreads; axle numbers stay the input\'s', () => {
    // Tridem 4.5 ft apart with the middle axle up: the two axles down are 9 ft apart → bridge (9 ft, 2) = 39,000
    // (references §1 cell (9, 2)), not the tandem 34,000.
    const r = checkAxleWeights([
      { positionFt: 0, weightLb: 12_000 },
      { positionFt: 30, weightLb: 18_000, group: 't' },
      { positionFt: 34.5, weightLb: 0, group: 't', lifted: true },
      { positionFt: 39, weightLb: 18_000, group: 't' },
    ]);
    const pair = r.groups.find((g) => g.fromAxle === 2 && g.toAxle === 4 && g.rule !== 'gross')!;
    expect(pair).toMatchObject({ rule: 'bridge-formula', limitLb: 39_000, axleCount: 2 });
    expect(r.axleGroups.find((g) => g.key === 't')).toMatchObject({ axles: [2, 4], axleCount: 2, liftedCount: 1, spreadFt: 9 });
    expect(r.groups.some((g) => g.fromAxle === 3 || g.toAxle === 3)).toBe(false);
  });

  it('a lift axle that is up but carries weight → RangeError', () => {
    expect(() => checkAxleWeights([{ positionFt: 0, weightLb: 10, lifted: true }, { positionFt: 5, weightLb: 10 }])).toThrow(/lift axle that is up/);
  });

  it('TX record, TxDMV "Texas Size/Weight Limits" (triple axle group 42,000 lb): a tridem is checked against it, not the tandem', () => {
    const axles = [{ positionFt: 0, weightLb: 12_000 }, ...tandem(20, 34_000), { positionFt: 50, weightLb: 14_000 }, { positionFt: 54, weightLb: 14_000 }, { positionFt: 58, weightLb: 13_500 }];
    // Federal: the three axles 8 ft apart are a tandem → 41,500 over 34,000.
    expect(checkAxleWeights(axles).violations.map((v) => v.rule)).toContain('tandem');
    const tx = checkAxleWeights(axles, { tridemLb: 42_000 });
    expect(tx.groups.some((g) => g.fromAxle === 4 && g.toAxle === 6 && g.rule === 'tandem')).toBe(false);
    expect(tx.findings).toEqual([expect.objectContaining({ rule: 'tridem', axles: [4, 5, 6], weightLb: 41_500, limitLb: 42_000, ok: true })]);
    const over = checkAxleWeights(axles.map((a, i) => (i === 5 ? { ...a, weightLb: 14_500 } : a)), { tridemLb: 42_000 });
    expect(over.legal).toBe(false);
    expect(over.findingViolations[0].message).toMatch(/tridem group.*42,500 lb against 42,000 lb, over by 500 lb/);
  });

  it('Minn. Stat. 169.823 subd. 1(3): 500 lb per inch of tire width on non-steering axles, 600 on steering axles', () => {
    // Drive axle on two 425/65R22.5 singles: 2 × 16.73 in = 33.46 in → 16,732 lb; 17,000 is over by 268 lb.
    const wide = { size: '425/65R22.5', count: 2 };
    const axles = [
      { positionFt: 0, weightLb: 12_000, steer: true, tires: { size: '11R22.5', count: 2 } },
      { positionFt: 18, weightLb: 17_000, tires: wide },
      { positionFt: 22.5, weightLb: 16_000, tires: wide },
    ];
    const r = checkAxleWeights(axles, { tireLbPerInch: 500 });
    const w = r.findings.filter((f) => f.rule === 'tire-width');
    expect(w.map((f) => f.axles[0])).toEqual([2, 3]); // the steer axle apart unless a steer figure is given
    expect(w[0].limitLb).toBeCloseTo((500 * 2 * 425) / 25.4, 6);
    expect(w[0].ok).toBe(false);
    expect(Math.round(w[0].overByLb)).toBe(268);
    expect(w[1].ok).toBe(true);
    // Steer: 600 lb/in × 2 × 11 in = 13,200 ≥ 12,000.
    const mn = checkAxleWeights(axles, { tireLbPerInch: 500, steerTireLbPerInch: 600 });
    expect(mn.findings.find((f) => f.axles[0] === 1)).toMatchObject({ rule: 'tire-width', limitLb: 13_200, ok: true });
  });

  it('Conn. Gen. Stat. § 14-267a(b): 600 lb per inch of tire width, on every axle when it applies to the steer too', () => {
    // Duals 4 × 11R22.5 = 44 in → 26,400 lb; steer 2 × 11 in = 22 in → 13,200 lb.
    const r = checkAxleWeights(
      [
        { positionFt: 0, weightLb: 13_500, steer: true, tires: { size: '11R22.5', count: 2 } },
        { positionFt: 18, weightLb: 17_000, tires: { size: '11R22.5', count: 4 } },
      ],
      { tireLbPerInch: 600, tireLbPerInchOnSteer: true },
    );
    expect(r.findings.map((f) => [f.axles[0], f.limitLb, f.ok])).toEqual([
      [1, 13_200, false],
      [2, 26_400, true],
    ]);
  });

  it('49 CFR 393.75(f): no tire carries more than its sidewall rating (rating as given); per-tire maximum where a text sets one', () => {
    const r = checkAxleWeights([{ positionFt: 0, weightLb: 12_500, tires: { size: '11R22.5', count: 2, ratingLb: 6_175 } }], { tireLbPerTire: 6_000 });
    expect(r.findings.map((f) => [f.rule, f.limitLb, f.ok])).toEqual([
      ['tire-per-tire', 12_000, false],
      ['tire-rating', 12_350, false],
    ]);
    expect(r.findingViolations.find((f) => f.rule === 'tire-rating')!.source).toMatch(/49 CFR 393.75\(f\)/);
  });

  it('axleLimitsFromRule: the TX record\'s legal tridem; the UT record\'s routine permit maxima by group, no bridge formula', () => {
    const tx = axleLimitsFromRule(loadRule('TX'));
    expect(tx.limits.tridemLb).toBe(42_000);
    const ut = axleLimitsFromRule(loadRule('UT'), 'permit');
    expect(ut.limits).toMatchObject({ singleAxleLb: 29_000, tandemLb: 50_000, tridemLb: 61_750, grossLb: 125_000, bridgeFormula: false });
    expect(ut.notOnFile).toContain('whether a permit bridge table applies');
  });
});
