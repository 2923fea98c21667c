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
    // 49 CFR 393.108 table, chain: no grade 80 cell in 7/16 in (5/8 in grade 70 is now on file: 15,800 lb).
    expect(() => defaultWll({ kind: 'chain', size: '7/16', grade: 80 })).toThrow(/marked/);
    expect(() => defaultWll({ kind: 'webbing', width: '5' })).toThrow(RangeError);
  });
});

// Every cell of the chain, webbing and wire rope tables of 49 CFR 393.108 (references §3 [V], read in the
// regulation; the same cells in the reproduction of the "Tables to §393.108").
const CHAIN: [string, string, 30 | 43 | 70 | 80 | 100, number][] = [];
const CHAIN_ROWS: [string, string, (number | null)[]][] = [
  ['1/4', '7 mm', [1_300, 2_600, 3_150, 3_500, 4_300]],
  ['5/16', '8 mm', [1_900, 3_900, 4_700, 4_500, 5_700]],
  ['3/8', '10 mm', [2_650, 5_400, 6_600, 7_100, 8_800]],
  ['7/16', '11 mm', [3_700, 7_200, 8_750, null, null]],
  ['1/2', '13 mm', [4_500, 9_200, 11_300, 12_000, 15_000]],
  ['5/8', '16 mm', [6_900, 13_000, 15_800, 18_100, 22_600]],
];
const GRADES = [30, 43, 70, 80, 100] as const;
const GRADE_NAMES: Record<number, string> = { 30: 'Grade 30 proof coil', 43: 'Grade 43 high test', 70: 'Grade 70 transport', 80: 'Grade 80 alloy', 100: 'Grade 100 alloy' };
for (const [inch, mm, cells] of CHAIN_ROWS) cells.forEach((w, i) => w !== null && CHAIN.push([inch, mm, GRADES[i], w]));

describe('defaultWll: every cell of the 49 CFR 393.108 tables on file', () => {
  it.each(CHAIN.map(([inch, mm, grade, wll]) => [`49 CFR 393.108 table, chain, ${GRADE_NAMES[grade]} ${inch} in (${mm}): ${wll} lb`, inch, mm, grade, wll] as const))(
    '%s',
    (_source, inch, mm, grade, wll) => {
      expect(defaultWll({ kind: 'chain', size: inch, grade }).wllLb).toBe(wll);
      expect(defaultWll({ kind: 'chain', size: mm, grade }).wllLb).toBe(wll);
    },
  );

  it.each([
    ['7/16', 80],
    ['7/16', 100],
  ] as const)('49 CFR 393.108 table, chain: no %s in grade %i cell → asks for the marked WLL', (size, grade) => {
    expect(() => defaultWll({ kind: 'chain', size, grade })).toThrow(/marked on it \(49 CFR 393.108\(b\)\)/);
  });

  it.each(CHAIN_ROWS.map(([inch, , cells]) => [inch, cells[0]!] as const))(
    '49 CFR 393.108(d): unmarked chain %s in counts as grade 30 proof coil: %i lb',
    (size, wll) => {
      const r = defaultWll({ kind: 'chain', size });
      expect(r.wllLb).toBe(wll);
      expect(r.note).toMatch(/grade 30 \(49 CFR 393.108\(d\)\)/);
    },
  );

  it.each([
    ['1 3/4', '45 mm', 1_750],
    ['2', '50 mm', 2_000],
    ['3', '75 mm', 3_000],
    ['4', '100 mm', 4_000],
  ] as const)('49 CFR 393.108 table, synthetic webbing %s in (%s): %i lb', (inch, mm, wll) => {
    expect(defaultWll({ kind: 'webbing', width: inch }).wllLb).toBe(wll);
    expect(defaultWll({ kind: 'webbing', width: mm }).wllLb).toBe(wll);
  });

  it.each([
    ['1/4', '7 mm', 1_400, '49 CFR 393.108 table'],
    ['5/16', '8 mm', 2_100, '49 CFR 393.108 table'],
    ['3/8', '10 mm', 3_000, '49 CFR 393.108 table'],
    ['7/16', '11 mm', 4_100, '49 CFR 393.108 table'],
    ['1/2', '13 mm', 5_300, '49 CFR 393.108 table'],
    ['5/8', '16 mm', 8_300, '49 CFR 393.108 table'],
    ['3/4', '20 mm', 10_900, '49 CFR 393.108 table'],
    ['7/8', '22 mm', 16_100, '49 CFR 393.108 table as first published, 59 FR (July 6, 1994), FR Doc. 94-16069'],
    ['1', '25 mm', 20_900, '49 CFR 393.108 table as first published, 59 FR (July 6, 1994), FR Doc. 94-16069'],
  ] as const)('wire rope (6 × 37, fiber core) %s in (%s): %i lb (%s)', (inch, mm, wll, _source) => {
    expect(defaultWll({ kind: 'wire-rope', diameter: inch }).wllLb).toBe(wll);
    expect(defaultWll({ kind: 'wire-rope', diameter: mm }).wllLb).toBe(wll);
    expect(defaultWll({ kind: 'wire-rope', diameter: inch }).note).toMatch(/393.108\(e\)\(2\)/);
  });

  // Manila and synthetic fiber rope: the table as first published, 59 FR (July 6, 1994), FR Doc. 94-16069,
  // "Tables to §393.102(b)(6)" (rows not read in the current eCFR text).
  const ROPE_SIZES = [
    ['3/8', '10 mm'],
    ['7/16', '11 mm'],
    ['1/2', '13 mm'],
    ['5/8', '16 mm'],
    ['3/4', '20 mm'],
    ['1', '25 mm'],
  ] as const;
  const ROPES: [string, 'manila-rope' | 'polypropylene' | 'polyester' | 'nylon', number[]][] = [
    ['Manila rope', 'manila-rope', [205, 265, 315, 465, 640, 1_050]],
    ['Polypropylene fiber rope (3-strand and 8-strand)', 'polypropylene', [400, 525, 625, 925, 1_275, 2_100]],
    ['Polyester fiber rope (3-strand and 8-strand)', 'polyester', [555, 750, 960, 1_500, 1_880, 3_300]],
    ['Nylon rope', 'nylon', [278, 410, 525, 935, 1_420, 2_520]],
  ];
  it.each(ROPES.flatMap(([name, kind, cells]) => cells.map((wll, i) => [`59 FR (July 6, 1994) table, ${name} ${ROPE_SIZES[i][0]} in (${ROPE_SIZES[i][1]}): ${wll} lb`, kind, ROPE_SIZES[i][0], ROPE_SIZES[i][1], wll] as const)))(
    '%s',
    (_source, kind, inch, mm, wll) => {
      const get = (diameter: string) => (kind === 'manila-rope' ? defaultWll({ kind, diameter }) : defaultWll({ kind: 'synthetic-rope', diameter, fiber: kind }));
      expect(get(inch).wllLb).toBe(wll);
      expect(get(mm).wllLb).toBe(wll);
      expect(get(inch).source).toMatch(/FR Doc. 94-16069/);
    },
  );

  it('49 CFR 393.108(c): synthetic cordage of unknown fiber counts as polypropylene (1/2 in: 625 lb)', () => {
    const r = defaultWll({ kind: 'synthetic-rope', diameter: '1/2' });
    expect(r.wllLb).toBe(625);
    expect(r.note).toMatch(/polypropylene \(49 CFR 393.108\(c\)\)/);
  });

  it('double braided nylon rope: its row was not read in the regulation text → asks for the marked WLL', () => {
    expect(() => defaultWll({ kind: 'synthetic-rope', diameter: '1/2', fiber: 'double-braided-nylon' })).toThrow(/marked on it/);
  });

  it('size notation: 3/8", 3/8 in and 10 mm are one size; 1-3/4 is 1 3/4', () => {
    for (const size of ['3/8"', '3/8 in', '3/8 inch', '10mm']) expect(defaultWll({ kind: 'chain', size, grade: 70 }).wllLb).toBe(6_600);
    expect(defaultWll({ kind: 'webbing', width: '1-3/4' }).wllLb).toBe(1_750);
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
