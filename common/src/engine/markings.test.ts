import { projectingLoadMarkings } from './markings';
import { fixtureRule, known } from './__fixtures__/facts';

// Marking rules in the shape of the cited texts (fixtures; the states' own records live in src/rulebook).
const OVERSIZE_SIGN = {
  text: 'OVERSIZE LOAD',
  minWidthIn: 84,
  minHeightIn: 18,
  letterHeightIn: 10,
  colors: 'black letters on yellow',
  positions: ['front of the vehicle', 'rear of the load'],
  escortSign: { text: 'OVERSIZE LOAD', minWidthIn: 60, minHeightIn: 12, letterHeightIn: 8 },
};
const SAMPLE_RULE_TX = fixtureRule('TX', 'Texas', {
  flags: known([{ kind: 'overhang' as const, when: [{ measure: 'rearOverhang' as const, atLeast: 48 }], minCount: 1, minSquareIn: 12, colors: 'red' }], 'Tex. Transp. Code 547.382'),
  lamps: known(
    [
      {
        when: [{ measure: 'rearOverhang' as const, atLeast: 48 }],
        lamps: [
          { position: 'rear of the load', color: 'red' as const, count: 2, visibleFt: 500 },
          { position: 'sides of the projecting load', color: 'red' as const, count: 2, visibleFt: 500 },
        ],
        reflectors: [{ position: 'rear of the load', color: 'red' as const, count: 2 }],
        note: 'at night',
      },
    ],
    'Tex. Transp. Code 547.382',
  ),
});
const SAMPLE_RULE_MD = fixtureRule('MD', 'Maryland', { signs: known([{ ...OVERSIZE_SIGN, strokeIn: 1.625, when: [{ measure: 'width' as const, over: 108 }] }], 'COMAR 11.04.04.01') });
const SAMPLE_RULE_NY = fixtureRule('NY', 'New York', {
  signs: known([{ ...OVERSIZE_SIGN, strokeIn: 1.41, when: [], whenOversize: true }], '17 NYCRR 154-1.13'),
  flags: known([{ kind: 'corners' as const, when: [], whenOversize: true, minCount: 4, minSquareIn: 18, colors: 'red or orange fluorescent' }], 'fixture corner flags'),
});

describe('projectingLoadMarkings', () => {
  // 49 CFR 393.87: strict "more than" thresholds.
  it.each([
    [4, 0, 0, false, 0, '49 CFR 393.87: exactly 4 in to the side → no flags'],
    [4.01, 0, 0, true, 0, '49 CFR 393.87: just over 4 in to the side'],
    [0, 48, 30, false, 0, '49 CFR 393.87: exactly 4 ft to the rear → no flags'],
    [0, 48.5, 24, false, 1, '49 CFR 393.87: over 4 ft, projecting part 2 ft wide → one flag'],
    [0, 60, 24.5, false, 2, '49 CFR 393.87: over 4 ft, projecting part wider than 2 ft → two flags'],
    [6, 72, 96, true, 2, '49 CFR 393.87: both'],
  ])('side %f in, rear %f in, rear width %f in → side flags %p, rear flags %i (%s)', (side, rear, rearWidth, sideFlags, rearFlags) => {
    const r = projectingLoadMarkings({ sideProjectionIn: side, rearProjectionIn: rear, rearProjectionWidthIn: rearWidth });
    expect(r.sideFlags).toBe(sideFlags);
    expect(r.rearFlags).toBe(rearFlags);
    expect(r.flags.filter((f) => f.position.startsWith('extreme rear'))).toHaveLength(rearFlags);
    for (const f of r.flags) {
      expect(f.minSquareIn).toBe(18);
      expect(f.source).toBe('49 CFR 393.87');
    }
  });

  it('49 CFR 393.87: left and right projections flag only the projecting side', () => {
    const r = projectingLoadMarkings({ sideProjectionIn: 9, sideProjectionLeftIn: 0, sideProjectionRightIn: 9, rearProjectionIn: 0, rearProjectionWidthIn: 0 });
    expect(r.flags.map((f) => f.position)).toEqual(['right, front extremity of the projection', 'right, rear extremity of the projection']);
  });

  // 49 CFR 393.11 Table 1 [S]: red lamp at 4 ft or more (inclusive) — lamp rules as rulebook data.
  it.each([
    [47.9, 0],
    [48, 1],
  ])('49 CFR 393.11 (secondary summary): rear projection %f in → %i red lamp(s) at night', (rear, n) => {
    const r = projectingLoadMarkings({ sideProjectionIn: 0, rearProjectionIn: rear, rearProjectionWidthIn: 12 });
    expect(r.lamps.filter((l) => l.color === 'red')).toHaveLength(n);
  });

  it('Tex. Transp. Code 547.382: at least 4 ft rear → two red lamps and two red side lamps visible 500 ft, two red reflectors, 12 in day flags', () => {
    const r = projectingLoadMarkings({ sideProjectionIn: 0, rearProjectionIn: 48, rearProjectionWidthIn: 12, widthIn: 102, heightIn: 150, lengthIn: 900 }, SAMPLE_RULE_TX);
    const tx = r.lamps.filter((l) => l.source.includes('547.382'));
    expect(tx.reduce((s, l) => s + l.count, 0)).toBe(4);
    expect(tx.every((l) => l.visibleFt === 500 && l.color === 'red')).toBe(true);
    expect(r.reflectors).toEqual([expect.objectContaining({ color: 'red', count: 2 })]);
    expect(r.flags.some((f) => f.minSquareIn === 12 && f.source.includes('547.382'))).toBe(true);
    // federal 393.87 needs more than 4 ft: no federal rear flag at exactly 48 in
    expect(r.rearFlags).toBe(0);
  });

  it.each([
    [108, 0, 'COMAR 11.04.04.01: exactly 9 ft wide → no sign'],
    [109, 2, 'COMAR 11.04.04.01: above 9 ft → OVERSIZE LOAD front and rear'],
  ])('Maryland: width %i in → %i signs (%s)', (width, n) => {
    const r = projectingLoadMarkings({ sideProjectionIn: 3, rearProjectionIn: 0, rearProjectionWidthIn: 0, widthIn: width, heightIn: 150, lengthIn: 900 }, SAMPLE_RULE_MD, width > 102);
    expect(r.signs).toHaveLength(n);
    if (n > 0) {
      expect(r.signs[0]).toMatchObject({ text: 'OVERSIZE LOAD', minWidthIn: 84, minHeightIn: 18, letterHeightIn: 10, strokeIn: 1.625 });
      expect(r.escortSigns[0]).toMatchObject({ minWidthIn: 60, minHeightIn: 12, letterHeightIn: 8 });
    }
  });

  it('17 NYCRR 154-1.13: oversize load → sign with 1.41 in stroke; corner flags from the rule’s own source', () => {
    const r = projectingLoadMarkings({ sideProjectionIn: 20, rearProjectionIn: 0, rearProjectionWidthIn: 0, widthIn: 142, heightIn: 150, lengthIn: 900 }, SAMPLE_RULE_NY, true);
    expect(r.signs[0].strokeIn).toBe(1.41);
    expect(r.signs[0].source).toMatch(/17 NYCRR 154-1.13/);
    const corners = r.flags.filter((f) => f.position.includes('corner'));
    expect(corners).toHaveLength(4);
    expect(corners[0].source).toMatch(/fixture corner flags/);
  });

  it('a rule with signs, flags and lamps not on file says so (federal 393.87 flags and 393.11 lamps still listed)', () => {
    const r = projectingLoadMarkings({ sideProjectionIn: 20, rearProjectionIn: 60, rearProjectionWidthIn: 12, widthIn: 142 }, fixtureRule('GA', 'Georgia'), true);
    expect(r.notOnFile).toEqual({ signs: true, flags: true, lamps: true });
    expect(r.signs).toEqual([]);
    expect(r.flags.every((f) => f.source === '49 CFR 393.87')).toBe(true);
    expect(r.reasons.filter((x) => /not on file/.test(x.message))).toHaveLength(3);
  });

  it('bad input → RangeError', () => {
    expect(() => projectingLoadMarkings({ sideProjectionIn: -1, rearProjectionIn: 0, rearProjectionWidthIn: 0 })).toThrow(/sideProjectionIn must be at least 0/);
    expect(() => projectingLoadMarkings({ sideProjectionIn: 0, rearProjectionIn: Number.NaN, rearProjectionWidthIn: 0 })).toThrow(/rearProjectionIn/);
  });
});

describe('jurisdiction flag rules (rulebook data)', () => {
  // 290-RICR-40-00-1.5 (Rhode Island): red or orange fluorescent flags at least 18 in square, 2 to 6 at the widest
  // extremity of an overwidth load.
  const ri = fixtureRule('RI', 'Rhode Island', {
    signs: known([]),
    flags: known(
      [{ kind: 'width-extremities' as const, when: [], whenOversize: true, minCount: 2, maxCount: 6, minSquareIn: 18, colors: 'red or orange fluorescent' }],
      '290-RICR-40-00-1.5',
    ),
  });
  it.each([
    [102, 0],
    [103, 2],
  ])('290-RICR-40-00-1.5: width %i in → %i flags at the widest extremity', (widthIn, n) => {
    const r = projectingLoadMarkings({ sideProjectionIn: 0, rearProjectionIn: 0, rearProjectionWidthIn: 0, widthIn, heightIn: 150, lengthIn: 900 }, ri, widthIn > 102);
    const f = r.flags.filter((x) => x.source.includes('290-RICR'));
    expect(f).toHaveLength(n);
    for (const x of f) expect(x.minSquareIn).toBe(18);
  });
});
