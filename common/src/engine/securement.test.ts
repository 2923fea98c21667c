import { SECUREMENT_PERFORMANCE, TYPICAL_ANCHOR_WLL, checkSecurement, creditedWll, defaultWll, minimumTiedowns } from './securement';

describe('minimumTiedowns (49 CFR 393.110)', () => {
  it.each([
    // check values, references §3
    [5, 1_100, false, 1, '49 CFR 393.110'],
    [5, 1_101, false, 2, '49 CFR 393.110'],
    [6, 300, false, 2, '49 CFR 393.110'],
    [18, 5_000, false, 3, '49 CFR 393.110 (FMCSA brochure example)'],
    // boundaries: exactly 10 ft, just over, 20 ft
    [10, 5_000, false, 2, '49 CFR 393.110: exactly 10 ft'],
    [10.01, 5_000, false, 3, '49 CFR 393.110: just over 10 ft'],
    [20, 5_000, false, 3, '49 CFR 393.110: exactly 20 ft'],
    [20.5, 5_000, false, 4, '49 CFR 393.110: fraction of a further 10 ft'],
    [4, 500, false, 1, '49 CFR 393.110'],
    [5.01, 500, false, 2, '49 CFR 393.110: just over 5 ft'],
    // blocked forward: 1 per 10 ft or fraction
    [4, 5_000, true, 1, '49 CFR 393.110(c)'],
    [10, 5_000, true, 1, '49 CFR 393.110(c): exactly 10 ft'],
    [10.5, 5_000, true, 2, '49 CFR 393.110(c)'],
    [30, 5_000, true, 3, '49 CFR 393.110(c)'],
  ])('%f ft, %i lb, blocked %p → %i (%s)', (lengthFt, weightLb, blockedForward, n) => {
    expect(minimumTiedowns({ lengthFt, weightLb, blockedForward })).toBe(n);
  });

  it.each([
    [{ lengthFt: 0, weightLb: 100, blockedForward: false }, /lengthFt must be greater than 0/],
    [{ lengthFt: -2, weightLb: 100, blockedForward: false }, /lengthFt/],
    [{ lengthFt: 4, weightLb: Number.NaN, blockedForward: false }, /weightLb must be a finite number/],
    [{ lengthFt: 4000, weightLb: 100, blockedForward: false }, /absurd/],
    [{ lengthFt: 4, weightLb: 100, blockedForward: 'yes' }, /blockedForward must be true or false/],
  ])('bad input → RangeError (%#)', (input, msg) => {
    expect(() => minimumTiedowns(input as never)).toThrow(RangeError);
    expect(() => minimumTiedowns(input as never)).toThrow(msg);
  });
});

describe('creditedWll (49 CFR 393.108(a), 393.106(d))', () => {
  it.each([
    [6_600, undefined, 'direct', 3_300, '49 CFR 393.106(d): direct tiedown credited at half'],
    [6_600, undefined, 'same-side', 3_300, '49 CFR 393.106(d): over the article, back to the same side: half'],
    [6_600, undefined, 'side-to-side', 6_600, '49 CFR 393.106(d): side to side: full'],
    [6_600, 5_000, 'side-to-side', 5_000, '49 CFR 393.108(a): anchor lower than the chain governs (stake pocket, common practice, no published source)'],
    [6_600, 5_000, 'direct', 2_500, '49 CFR 393.108(a) then 393.106(d)'],
    [4_000, 6_600, 'side-to-side', 4_000, '49 CFR 393.108(a): strap lower than the winch (winch 6,600: common practice, no published source)'],
  ] as const)('WLL %i, anchor %p, %s → %i (%s)', (wllLb, anchorWllLb, path, credited, _source) => {
    expect(creditedWll({ wllLb, anchorWllLb, path })).toBe(credited);
  });

  it('bad path / negative → RangeError', () => {
    expect(() => creditedWll({ wllLb: 100, path: 'diagonal' as never })).toThrow(/path must be/);
    expect(() => creditedWll({ wllLb: -1, path: 'direct' })).toThrow(/wllLb must be at least 0/);
  });
});

describe('defaultWll (49 CFR 393.108 table)', () => {
  it.each([
    [{ kind: 'chain', size: '3/8', grade: 30 }, 2_650],
    [{ kind: 'chain', size: '3/8', grade: 43 }, 5_400],
    [{ kind: 'chain', size: '3/8', grade: 70 }, 6_600],
    [{ kind: 'chain', size: '3/8', grade: 80 }, 7_100],
    [{ kind: 'chain', size: '3/8', grade: 100 }, 8_800],
    [{ kind: 'chain', size: '1/2', grade: 70 }, 11_300],
    [{ kind: 'chain', size: '5/16', grade: 70 }, 4_700],
    [{ kind: 'chain', size: '5/16', grade: 80 }, 4_500],
    [{ kind: 'chain', size: '3/8' }, 2_650], // 393.108(d): unmarked chain counts as grade 30
    [{ kind: 'webbing', width: '1 3/4' }, 1_750],
    [{ kind: 'webbing', width: '2' }, 2_000],
    [{ kind: 'webbing', width: '3' }, 3_000],
    [{ kind: 'webbing', width: '4' }, 4_000],
  ] as const)('49 CFR 393.108 table: %j → %i lb', (input, wll) => {
    expect(defaultWll(input).wllLb).toBe(wll);
  });

  it('49 CFR 393.108(d): unmarked chain says it was counted as grade 30', () => {
    expect(defaultWll({ kind: 'chain', size: '3/8' }).note).toMatch(/grade 30/);
  });

  it('a cell not on file → RangeError asking for the marked WLL (393.108(b))', () => {
    expect(() => defaultWll({ kind: 'chain', size: '5/8', grade: 70 })).toThrow(/marked/);
    expect(() => defaultWll({ kind: 'webbing', width: '5' })).toThrow(RangeError);
  });
});

describe('checkSecurement', () => {
  it('FMCSA brochure (393.106): 30,000 lb cargo needs aggregate WLL ≥ 15,000', () => {
    const r = checkSecurement({
      weightLb: 30_000,
      lengthFt: 20,
      blockedForward: false,
      tiedowns: Array(4).fill({ wllLb: 6_600, path: 'side-to-side' }),
    });
    expect(r.requiredAggregateLb).toBe(15_000);
    expect(r.aggregateLb).toBe(26_400);
    expect(r.requiredCount).toBe(3);
    expect(r.ok).toBe(true);
  });

  it('references §3 [D]: 11,000 lb machine on four direct grade 70 3/8 in chains → 13,200 ≥ 5,500, passes 393.130', () => {
    const chain = defaultWll({ kind: 'chain', size: '3/8', grade: 70 }).wllLb;
    const r = checkSecurement({
      weightLb: 11_000,
      lengthFt: 14,
      blockedForward: false,
      heavyEquipment: true,
      tiedowns: Array(4).fill({ wllLb: chain, path: 'direct' }),
    });
    expect(r.aggregateLb).toBe(13_200);
    expect(r.requiredAggregateLb).toBe(5_500);
    expect(r.requiredCount).toBe(4);
    expect(r.ok).toBe(true);
    expect(r.findings.join(' ')).toMatch(/articulation/);
    expect(r.caution).toMatch(/planning aid/i);
  });

  it('49 CFR 393.130: equipment over 10,000 lb on three chains, one of them on a 4,000 lb anchor → fails twice', () => {
    const r = checkSecurement({
      weightLb: 24_000,
      lengthFt: 8,
      blockedForward: false,
      heavyEquipment: true,
      tiedowns: [
        { wllLb: 6_600, path: 'direct' },
        { wllLb: 6_600, path: 'direct' },
        { wllLb: 6_600, anchorWllLb: 4_000, anchorKind: 'stake pocket', path: 'direct' },
      ],
    });
    expect(r.ok).toBe(false);
    expect(r.requiredCount).toBe(4);
    expect(r.findings.some((f) => /at least 4 required/.test(f))).toBe(true);
    expect(r.findings.some((f) => /rated 4,000 lb/.test(f))).toBe(true);
    expect(r.reasons.some((x) => x.code === 'anchor-governs')).toBe(true);
  });

  it('49 CFR 393.130: exactly 10,000 lb is not "over 10,000"', () => {
    const r = checkSecurement({ weightLb: 10_000, lengthFt: 8, blockedForward: false, heavyEquipment: true, tiedowns: Array(2).fill({ wllLb: 5_400, path: 'direct' }) });
    expect(r.requiredCount).toBe(2);
    expect(r.ok).toBe(true);
  });

  it('49 CFR 393.106: aggregate below half the weight fails with the numbers', () => {
    const r = checkSecurement({ weightLb: 40_000, lengthFt: 9, blockedForward: false, tiedowns: Array(4).fill({ wllLb: 6_600, path: 'direct' }) });
    expect(r.ok).toBe(false);
    expect(r.findings[0]).toMatch(/13,200 lb is below half the weight, 20,000 lb/);
  });

  it('edge protection reminder (49 CFR 393.104, secondary summary) for sharp edges', () => {
    const r = checkSecurement({
      weightLb: 4_000,
      lengthFt: 9,
      blockedForward: false,
      sharpEdges: true,
      tiedowns: [
        { wllLb: 4_000, path: 'side-to-side', edgeProtection: true },
        { wllLb: 4_000, path: 'side-to-side' },
      ],
    });
    expect(r.findings.join(' ')).toMatch(/edge protection .*1 tiedown without it/);
  });

  it('bad input → RangeError', () => {
    expect(() => checkSecurement({ weightLb: 0, lengthFt: 3, blockedForward: false, tiedowns: [] })).toThrow(/weightLb must be greater than 0/);
    expect(() => checkSecurement({ weightLb: 10, lengthFt: 3, blockedForward: false, tiedowns: [{ wllLb: Number.NaN, path: 'direct' }] })).toThrow(/wllLb/);
  });
});

describe('reference constants', () => {
  it('49 CFR 393.102: 0.8 / 0.5 / 0.5 g breaking strength, 0.435 / 0.5 / 0.25 g working load limit, 20 % downward', () => {
    expect(SECUREMENT_PERFORMANCE.breakingStrength).toEqual({ forward: 0.8, rearward: 0.5, lateral: 0.5 });
    expect(SECUREMENT_PERFORMANCE.workingLoadLimit).toEqual({ forward: 0.435, rearward: 0.5, lateral: 0.25 });
    expect(SECUREMENT_PERFORMANCE.downwardFractionIfNotContained).toBe(0.2);
  });

  it.each([
    ['slidingWinch', 6_600],
    ['pipeSpool', 6_600],
    ['stakePocket', 5_000],
  ] as const)('common practice, no published source: %s rated about %i lb; a grade 70 chain in it is credited at most that', (anchor, rating) => {
    expect(TYPICAL_ANCHOR_WLL[anchor]).toBe(rating);
    expect(creditedWll({ wllLb: 11_300, anchorWllLb: TYPICAL_ANCHOR_WLL[anchor], path: 'side-to-side' })).toBe(rating);
  });
});
