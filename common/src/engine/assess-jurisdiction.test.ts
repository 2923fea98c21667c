/**
 * Engine semantics of the per-jurisdiction assessment, on fixture records shaped as the cited texts word them.
 * The states' own records and the check values read from their texts are tested in src/rulebook.
 */
import { federalLegal, fixtureRule, known, unknown } from './__fixtures__/facts';
import { assessJurisdiction, escortsForRoad } from './assess-jurisdiction';
import type { EscortRule, MeasuredLoad, RoadType } from './jurisdiction-rule';

const FT = 12;
const base: MeasuredLoad = { widthIn: 102, heightIn: 150, lengthIn: 70 * FT, frontOverhangIn: 0, rearOverhangIn: 0, sideProjectionIn: 0, grossLb: 80_000 };
const load = (p: Partial<MeasuredLoad>): MeasuredLoad => ({ ...base, ...p });
const ALL: RoadType[] = ['two-lane', 'multilane', 'interstate'];
const DIVIDED: RoadType[] = ['multilane', 'interstate'];
const r = (measure: EscortRule['when']['measure'], over: number, roads: RoadType[], front: number, rear: number, extra: Partial<EscortRule> = {}): EscortRule => ({
  when: { measure, over },
  roads,
  front,
  rear,
  ...extra,
});

// Escort thresholds in the shape of TxDMV "Escort and Equipment Requirements" (fixture, not the Texas record).
const TX_SHAPE = fixtureRule('TX', 'Texas', {
  legal: { ...federalLegal(), heightIn: known(14 * FT), overallLengthIn: known<number | null>(null) },
  escorts: {
    width: known([r('width', 14 * FT, ['two-lane'], 1, 0), r('width', 14 * FT, DIVIDED, 0, 1), r('width', 16 * FT, ALL, 1, 1)]),
    height: known([r('height', 17 * FT, ALL, 1, 0, { heightPole: true }), r('height', 18 * FT, ALL, 1, 1, { heightPole: true })]),
    length: known([r('length', 110 * FT, ['two-lane'], 1, 0), r('length', 110 * FT, DIVIDED, 0, 1), r('length', 125 * FT, ALL, 1, 1)]),
    frontOverhang: known([r('frontOverhang', 20 * FT, ['two-lane'], 1, 0), r('frontOverhang', 20 * FT, DIVIDED, 0, 1)]),
    rearOverhang: known([r('rearOverhang', 20 * FT, ALL, 0, 1)]),
    sideProjection: known<EscortRule[]>([]),
    twoDimensionRule: known<{ exceptPairs: ['length' | 'frontOverhang' | 'rearOverhang', 'length' | 'frontOverhang' | 'rearOverhang'][] } | null>({
      exceptPairs: [
        ['length', 'frontOverhang'],
        ['length', 'rearOverhang'],
      ],
    }),
    heightPoleMarginIn: known(3),
  },
  fee: known({ baseUsd: 60, weightBrackets: [{ overLb: 80_000, upToLb: 120_000, feeUsd: 150 }] }),
  superload: known({ widthOverIn: 20 * FT, grossOverLb: 254_300 }),
  permit: { validityDays: known(5), leadTimeDays: known(0) },
  signs: known([]),
  flags: known([]),
  lamps: known([]),
});

describe('escortsForRoad', () => {
  it.each([
    [{ widthIn: 14 * FT }, 'two-lane', 0, 0, false],
    [{ widthIn: 14 * FT + 1 }, 'two-lane', 1, 0, false],
    [{ widthIn: 14 * FT + 1 }, 'multilane', 0, 1, false],
    [{ widthIn: 16 * FT }, 'interstate', 0, 1, false],
    [{ widthIn: 16 * FT + 1 }, 'two-lane', 1, 1, false],
    [{ heightIn: 17 * FT }, 'two-lane', 0, 0, false],
    [{ heightIn: 17 * FT + 1 }, 'interstate', 1, 0, true],
    [{ heightIn: 18 * FT + 1 }, 'two-lane', 1, 1, true],
    [{ lengthIn: 110 * FT + 1 }, 'two-lane', 1, 0, false],
    [{ lengthIn: 125 * FT + 1 }, 'multilane', 1, 1, false],
    [{ frontOverhangIn: 20 * FT + 1 }, 'multilane', 0, 1, false],
    [{ rearOverhangIn: 20 * FT + 1 }, 'two-lane', 0, 1, false],
    // two measures over escort limits → front and rear ...
    [{ widthIn: 14 * FT + 6, heightIn: 17 * FT + 6 }, 'two-lane', 1, 1, true],
    // ... except the excepted pair (length and an overhang)
    [{ lengthIn: 112 * FT, frontOverhangIn: 21 * FT }, 'two-lane', 1, 0, false],
  ] as const)('"over" thresholds per measure, highest crossed governs: %j on %s → %i front, %i rear, pole %p', (p, road, front, rear, pole) => {
    const e = escortsForRoad(TX_SHAPE, load(p), road);
    expect([e.front, e.rear, e.heightPole, e.known]).toEqual([front, rear, pole, true]);
    for (const x of e.reasons) expect(x.source).toMatch(/test fixture/);
  });

  it('"at least" thresholds are inclusive, "over" strict', () => {
    const rule = fixtureRule('VA', 'Virginia', { escorts: { width: known([{ when: { measure: 'width', atLeast: 12 * FT }, roads: ALL, front: 1, rear: 0 }]) } });
    expect(escortsForRoad(rule, load({ widthIn: 12 * FT - 1 }), 'two-lane').front).toBe(0);
    expect(escortsForRoad(rule, load({ widthIn: 12 * FT }), 'two-lane').front).toBe(1);
  });
});

describe('assessJurisdiction: not on file is never none', () => {
  const GA_BLANK = fixtureRule('GA', 'Georgia');

  it('a 14 ft 6 in wide load through a state with nothing on file: permit (federal width), escorts, fee, travel questions open', () => {
    const a = assessJurisdiction(GA_BLANK, { dimensions: load({ widthIn: 174 }), miles: 120, roadTypes: ['two-lane'] });
    expect(a.permitRequired).toBe(true);
    // 23 CFR 658.15: no state may set a width other than 102 in on the National Network
    expect(a.permitReasons[0]).toMatchObject({ code: 'over-legal-width', limit: 102, source: expect.stringMatching(/23 CFR 658.15/) });
    expect(a.permitReasons[0].message).toMatch(/not on file/);
    expect(a.escorts.known).toBe(false);
    expect(a.escorts.unknownMeasures).toContain('width');
    expect(a.fee).toEqual({ known: false, totalUsd: null, message: expect.stringMatching(/fee not on file/) });
    expect(a.permit.validityDays).toBeNull();
    const topics = a.openQuestions.map((q) => q.topic);
    expect(topics).toEqual(expect.arrayContaining(['escorts', 'fee', 'signs', 'superload', 'permit.validityDays']));
    for (const q of a.openQuestions) expect(q.message).toMatch(/not on file — check the permit/);
  });

  it('escort rules on file for width but not height: a wide-only load is known, a wide and tall one is not', () => {
    const rule = fixtureRule('KS', 'Kansas', {
      legal: { ...federalLegal(), heightIn: known(14 * FT) },
      escorts: { width: known([r('width', 14 * FT, ALL, 1, 0)]), length: known<EscortRule[]>([]) },
    });
    const wide = assessJurisdiction(rule, { dimensions: load({ widthIn: 174 }), miles: 10, roadTypes: ['two-lane'] });
    expect([wide.escorts.known, wide.escorts.front]).toEqual([true, 1]);
    const tall = assessJurisdiction(rule, { dimensions: load({ widthIn: 174, heightIn: 14 * FT + 6 }), miles: 10, roadTypes: ['two-lane'] });
    expect(tall.escorts.known).toBe(false);
    expect(tall.escorts.unknownMeasures).toEqual(['height']);
    expect(tall.escorts.front).toBe(1); // a floor, not the answer
  });

  it('a sourced "no limit" (null) is not a question; a limit not on file is, when nothing else asks a permit', () => {
    const open = fixtureRule('XX', 'Fixture', { legal: { ...federalLegal(), heightIn: unknown() } });
    const a = assessJurisdiction(open, { dimensions: load({ heightIn: 14 * FT }), miles: 10, roadTypes: ['interstate'] });
    expect(a.permitRequired).toBe(false);
    expect(a.permitKnown).toBe(false);
    expect(a.openQuestions.map((q) => q.topic)).toContain('legal.heightIn');
    const low = assessJurisdiction(open, { dimensions: load({ heightIn: 13 * FT }), miles: 10, roadTypes: ['interstate'] });
    expect(low.permitKnown).toBe(true); // 13 ft is under every state's legal height (13 ft 6 in or more)
  });

  it('weights not on file: the federal Interstate limits decide, and the reason says the state’s own are not on file', () => {
    const axles = [0, 16, 20, 51, 55].map((positionFt, i) => ({ positionFt, weightLb: i === 0 ? 12_000 : 20_000 }));
    const a = assessJurisdiction(GA_BLANK, { dimensions: load({ grossLb: 92_000 }), axles, miles: 50, roadTypes: ['interstate'] });
    expect(a.overweight).toBe(true);
    // 23 U.S.C. 127(a): 34,000 lb tandem
    expect(a.permitReasons.some((x) => x.code === 'overweight-tandem' && x.value === 40_000 && x.limit === 34_000 && /not on file/.test(x.source))).toBe(true);
    expect(a.openQuestions.map((q) => q.topic)).toContain('legal.weights');
  });
});

describe('assessJurisdiction: values on file', () => {
  it('no overall length limit (a sourced null): a stretched semitrailer over the state’s semitrailer limit needs a permit', () => {
    const rule = fixtureRule('VA', 'Virginia', { legal: { ...federalLegal(), overallLengthIn: known<number | null>(null), semitrailerLengthIn: known<number | null>(53 * FT) } });
    const at = (trailerLengthIn: number) => assessJurisdiction(rule, { dimensions: { ...load({ lengthIn: 90 * FT }), trailerLengthIn }, miles: 10, roadTypes: ['interstate'] });
    expect(at(53 * FT).permitRequired).toBe(false);
    const long = at(53 * FT + 1);
    expect(long.permitRequired).toBe(true);
    expect(long.permitReasons[0]).toMatchObject({ code: 'over-legal-length', value: 53 * FT + 1, limit: 53 * FT });
  });

  it('11 ft wide is over the legal 8\'6" by 2\'6"; the permit reason says which limit and by how much', () => {
    const a = assessJurisdiction(TX_SHAPE, { dimensions: load({ widthIn: 132 }), miles: 100, roadTypes: ['multilane'] });
    expect(a.permitReasons[0]).toMatchObject({ code: 'over-legal-width', value: 132, limit: 102 });
    expect(a.permitReasons[0].message).toBe(`width 11'0" is over the legal 8'6" by 2'6"`);
    expect(a.fee).toMatchObject({ known: true, totalUsd: 60 });
    expect(a.escorts.known).toBe(true);
    expect(a.openQuestions).toEqual([]);
    expect(a.cautions.join(' ')).toMatch(/issued permit governs/);
  });

  it('height pole set the rule’s margin above the load', () => {
    const a = assessJurisdiction(TX_SHAPE, { dimensions: load({ heightIn: 17 * FT + 6 }), miles: 100, roadTypes: ['interstate'] });
    expect(a.escorts).toMatchObject({ front: 1, heightPole: true, heightPoleSetIn: 17 * FT + 9 });
  });

  it('within legal limits: no permit, no fee, says why', () => {
    const a = assessJurisdiction(TX_SHAPE, { dimensions: base, miles: 100, roadTypes: ['two-lane'] });
    expect(a.permitRequired).toBe(false);
    expect(a.fee).toBeNull();
    expect(a.permitReasons[0].code).toBe('within-legal');
  });

  it('superload thresholds are flagged with their source', () => {
    const a = assessJurisdiction(TX_SHAPE, { dimensions: load({ widthIn: 21 * FT, grossLb: 260_000 }), miles: 100, roadTypes: ['two-lane'] });
    expect(a.superload.isSuperload).toBe(true);
    expect(a.superload.reasons.map((x) => x.code)).toEqual(['superload-width', 'superload-gross']);
  });

  it.each([
    [{ dimensions: load({ widthIn: -1 }), miles: 1, roadTypes: ['two-lane'] }, /dimensions.widthIn must be at least 0/],
    [{ dimensions: base, miles: Number.NaN, roadTypes: ['two-lane'] }, /miles must be a finite number/],
    [{ dimensions: base, miles: 1, roadTypes: [] }, /roadTypes must name at least one/],
  ])('bad input → RangeError (%#)', (input, msg) => {
    expect(() => assessJurisdiction(TX_SHAPE, input as never)).toThrow(msg);
  });
});
