import { assessJurisdiction, escortsForRoad } from './assess-jurisdiction';
import type { MeasuredLoad, RoadType } from './jurisdiction-rule';
import { FEDERAL_DEFAULT_RULE, SAMPLE_RULES, SAMPLE_RULE_FL, SAMPLE_RULE_TX, SAMPLE_RULE_VA } from './rulebook-samples';

const FT = 12;
const base: MeasuredLoad = { widthIn: 102, heightIn: 150, lengthIn: 70 * FT, frontOverhangIn: 0, rearOverhangIn: 0, sideProjectionIn: 0, grossLb: 80_000 };
const load = (p: Partial<MeasuredLoad>): MeasuredLoad => ({ ...base, ...p });

describe('escortsForRoad', () => {
  // TxDMV "Escort and Equipment Requirements" [V].
  it.each([
    [{ widthIn: 14 * FT }, 'two-lane', 0, 0, false],
    [{ widthIn: 14 * FT + 1 }, 'two-lane', 1, 0, false],
    [{ widthIn: 14 * FT + 1 }, 'multilane', 0, 1, false],
    [{ widthIn: 16 * FT }, 'interstate', 0, 1, false],
    [{ widthIn: 16 * FT + 1 }, 'two-lane', 1, 1, false],
    [{ widthIn: 16 * FT + 1 }, 'interstate', 1, 1, false],
    [{ heightIn: 17 * FT }, 'two-lane', 0, 0, false],
    [{ heightIn: 17 * FT + 1 }, 'interstate', 1, 0, true],
    [{ heightIn: 18 * FT + 1 }, 'two-lane', 1, 1, true],
    [{ lengthIn: 110 * FT }, 'two-lane', 0, 0, false],
    [{ lengthIn: 110 * FT + 1 }, 'two-lane', 1, 0, false],
    [{ lengthIn: 110 * FT + 1 }, 'multilane', 0, 1, false],
    [{ lengthIn: 125 * FT + 1 }, 'multilane', 1, 1, false],
    [{ frontOverhangIn: 20 * FT + 1 }, 'two-lane', 1, 0, false],
    [{ frontOverhangIn: 20 * FT + 1 }, 'multilane', 0, 1, false],
    [{ rearOverhangIn: 20 * FT + 1 }, 'two-lane', 0, 1, false],
    // two dimensions → front and rear ...
    [{ widthIn: 14 * FT + 6, heightIn: 17 * FT + 6 }, 'two-lane', 1, 1, true],
    // ... except when the two are length and an overhang
    [{ lengthIn: 112 * FT, frontOverhangIn: 21 * FT }, 'two-lane', 1, 0, false],
  ] as const)('TxDMV "Escort and Equipment Requirements": %j on %s → %i front, %i rear, pole %p', (p, road, front, rear, pole) => {
    const r = escortsForRoad(SAMPLE_RULE_TX, load(p), road);
    expect([r.front, r.rear, r.heightPole]).toEqual([front, rear, pole]);
    for (const x of r.reasons) expect(x.source).toMatch(/TxDMV/);
  });

  // 24VAC20-81-180 [V]: non-interstate / interstate.
  it.each([
    [12 * FT, 'two-lane', 0, 0],
    [12 * FT + 1, 'two-lane', 1, 1],
    [12 * FT + 1, 'interstate', 0, 1],
    [14 * FT + 1, 'multilane', 2, 1],
    [14 * FT + 1, 'interstate', 1, 1],
    [16 * FT + 1, 'two-lane', 2, 2],
    [16 * FT + 1, 'interstate', 1, 2],
  ] as const)('24VAC20-81-180: width %i in on %s → %i front, %i rear', (widthIn, road, front, rear) => {
    const r = escortsForRoad(SAMPLE_RULE_VA, load({ widthIn }), road as RoadType);
    expect([r.front, r.rear]).toEqual([front, rear]);
  });

  // Florida (university T2 summary) [S]: one over 12 ft wide, two over 14 ft; one over 14'6" high or 95 ft long.
  it.each([
    [{ widthIn: 12 * FT + 1 }, 1],
    [{ widthIn: 14 * FT + 1 }, 2],
    [{ heightIn: 14 * FT + 6 }, 0],
    [{ heightIn: 14 * FT + 7 }, 1],
    [{ lengthIn: 95 * FT + 1 }, 1],
  ])('Florida escort summary (secondary): %j → %i escort(s)', (p, n) => {
    const r = escortsForRoad(SAMPLE_RULE_FL, load(p), 'multilane');
    expect(r.front + r.rear).toBe(n);
  });
});

describe('assessJurisdiction', () => {
  it('24VAC20-81-180: over 14\'5" high → front escort with a height pole set 3 in above the load', () => {
    const a = assessJurisdiction(SAMPLE_RULE_VA, { dimensions: load({ heightIn: 14 * FT + 6 }), miles: 100, roadTypes: ['interstate'] });
    expect(a.escorts).toMatchObject({ front: 1, rear: 0, heightPole: true, heightPoleSetIn: 14 * FT + 9 });
    expect(a.escorts.reasons.some((r) => r.code === 'height-pole' && r.source.includes('24VAC20-81-180'))).toBe(true);
    expect(a.escorts.heightPoleSetIn).toBe(177);
    expect(a.permitRequired).toBe(true);
  });

  it('exactly 14\'5" in Virginia: no escort (strict "over")', () => {
    const a = assessJurisdiction(SAMPLE_RULE_VA, { dimensions: load({ heightIn: 14 * FT + 5 }), miles: 100, roadTypes: ['two-lane'] });
    expect(a.escorts.front + a.escorts.rear).toBe(0);
  });

  it('23 CFR 658.15: 11 ft wide is over the legal 8\'6" by 2\'6"; the permit reason says which limit and by how much', () => {
    const a = assessJurisdiction(SAMPLE_RULE_TX, { dimensions: load({ widthIn: 132 }), miles: 100, roadTypes: ['multilane'] });
    expect(a.permitRequired).toBe(true);
    expect(a.oversize).toBe(true);
    expect(a.permitReasons[0]).toMatchObject({ code: 'over-legal-width', value: 132, limit: 102 });
    expect(a.permitReasons[0].message).toBe(`width 11'0" is over the legal 8'6" by 2'6"`);
    expect(a.permitReasons[0].source).toMatch(/23 CFR 658.15/);
    expect(a.fee!.totalUsd).toBe(60); // 43 TAC 219.13: oversize only
    expect(a.cautions.join(' ')).toMatch(/check the issued permit/);
  });

  it('23 U.S.C. 127: axle violations make a permit necessary, with the numbers', () => {
    const axles = [0, 16, 20, 51, 55].map((positionFt, i) => ({ positionFt, weightLb: i === 0 ? 12_000 : 20_000 }));
    const a = assessJurisdiction(FEDERAL_DEFAULT_RULE, { dimensions: load({ grossLb: 92_000 }), axles, miles: 50, roadTypes: ['interstate'] });
    expect(a.overweight).toBe(true);
    expect(a.permitReasons.some((r) => r.code === 'overweight-tandem' && r.value === 40_000 && r.limit === 34_000)).toBe(true);
    expect(a.permitReasons.some((r) => r.code === 'overweight-gross')).toBe(true);
  });

  it('within legal limits: no permit, no fee, says why', () => {
    const a = assessJurisdiction(SAMPLE_RULE_TX, { dimensions: base, miles: 100, roadTypes: ['two-lane'] });
    expect(a.permitRequired).toBe(false);
    expect(a.fee).toBeNull();
    expect(a.permitReasons[0].code).toBe('within-legal');
  });

  it('superload thresholds (sample data) are flagged with their source', () => {
    const a = assessJurisdiction(SAMPLE_RULE_TX, { dimensions: load({ widthIn: 21 * FT, grossLb: 260_000 }), miles: 100, roadTypes: ['two-lane'] });
    expect(a.superload.isSuperload).toBe(true);
    expect(a.superload.reasons.map((r) => r.code)).toEqual(['superload-width', 'superload-gross']);
    expect(a.superload.reasons.every((r) => r.sample === true)).toBe(true);
  });

  it.each([
    [{ dimensions: load({ widthIn: -1 }), miles: 1, roadTypes: ['two-lane'] }, /dimensions.widthIn must be at least 0/],
    [{ dimensions: base, miles: Number.NaN, roadTypes: ['two-lane'] }, /miles must be a finite number/],
    [{ dimensions: base, miles: 1, roadTypes: [] }, /roadTypes must name at least one/],
  ])('bad input → RangeError (%#)', (input, msg) => {
    expect(() => assessJurisdiction(SAMPLE_RULE_TX, input as never)).toThrow(msg);
  });
});

describe('rulebook records', () => {
  it('are JSON-serialisable and every part has a source with an as-of date; unverified parts are marked sample', () => {
    for (const rule of Object.values(SAMPLE_RULES)) {
      expect(JSON.parse(JSON.stringify(rule))).toEqual(rule);
      const sources = [
        rule.legal.source,
        ...Object.values(rule.legal.dimensionSources),
        rule.permit.source,
        ...rule.escorts.rules.map((r) => r.source),
        ...rule.signs.map((s) => s.source),
        ...rule.flags.map((f) => f.source),
        ...rule.lamps.map((l) => l.source),
        rule.travel.weekends.source,
        rule.travel.holidays.source,
        rule.fee.source,
        rule.superload.source,
      ];
      for (const s of sources) {
        expect(s.asOf).toMatch(/^\d{4}-\d{2}-\d{2}$/);
        expect(s.citation.length).toBeGreaterThan(0);
        if (s.citation === 'sample data') expect(s.sample).toBe(true);
      }
    }
  });

  it('holds the references values with their citations', () => {
    expect(SAMPLE_RULE_TX.travel.daylight).toMatchObject({ startOffsetMin: -30, endOffsetMin: 30, source: { citation: 'Tex. Transp. Code 541.401' } });
    expect(SAMPLE_RULE_VA.travel.holidays).toMatchObject({ from: 'noon-weekday-before', source: { citation: '24VAC20-82-110' } });
    expect(SAMPLE_RULES.WA.travel.holidays.names).toContain('day-after-thanksgiving');
    expect(SAMPLE_RULES.MD.signs[0].when).toEqual([{ measure: 'width', over: 108 }]);
    expect(FEDERAL_DEFAULT_RULE.legal).toMatchObject({ widthIn: 102, singleAxleLb: 20_000, tandemLb: 34_000, grossLb: 80_000, tandemPairMinFt: 36 });
  });
});

describe('legal width variants', () => {
  // 23 CFR 658.15: 102 in on the National Network, Hawaii 108 in.
  const hawaii = {
    ...FEDERAL_DEFAULT_RULE,
    code: 'HI',
    name: 'Hawaii',
    legal: { ...FEDERAL_DEFAULT_RULE.legal, widthIn: 108 },
  };
  it.each([
    ['National Network', FEDERAL_DEFAULT_RULE, 102, false],
    ['National Network', FEDERAL_DEFAULT_RULE, 103, true],
    ['Hawaii', hawaii, 108, false],
    ['Hawaii', hawaii, 109, true],
  ])('23 CFR 658.15: %s, %#: width → permit', (_where, rule, widthIn, permit) => {
    expect(assessJurisdiction(rule, { dimensions: load({ widthIn }), miles: 10, roadTypes: ['interstate'] }).permitRequired).toBe(permit);
  });
});
