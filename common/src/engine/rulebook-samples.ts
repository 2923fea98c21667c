/**
 * The federal default rule and sample rulebook records. Values read in the references carry their citation;
 * everything else is marked `sample: true` ("sample data") and must be checked against the state's own rules.
 */
import type { EscortRule, JurisdictionRule, RoadType, SignRule } from './jurisdiction-rule';
import type { RuleSource } from './reasons';

/** Date the cited values were read from the project references. */
export const RULEBOOK_AS_OF = '2026-12-01';

const ref = (citation: string, note?: string): RuleSource => (note ? { citation, asOf: RULEBOOK_AS_OF, note } : { citation, asOf: RULEBOOK_AS_OF });
const sample = (note: string): RuleSource => ({ citation: 'sample data', asOf: RULEBOOK_AS_OF, sample: true, note });

const ALL_ROADS: RoadType[] = ['two-lane', 'multilane', 'interstate'];
const DIVIDED: RoadType[] = ['multilane', 'interstate'];
const NON_INTERSTATE: RoadType[] = ['two-lane', 'multilane'];
const FT = 12;

const SIX_HOLIDAYS = ['new-years-day', 'memorial-day', 'independence-day', 'labor-day', 'thanksgiving', 'christmas'] as const;

/** OVERSIZE LOAD sign by the NY/MD convention; applied elsewhere as sample data. */
function oversizeSign(source: RuleSource, strokeIn?: number): SignRule {
  return {
    when: [],
    whenOversize: true,
    text: 'OVERSIZE LOAD',
    minWidthIn: 7 * FT,
    minHeightIn: 18,
    letterHeightIn: 10,
    ...(strokeIn !== undefined ? { strokeIn } : {}),
    colors: 'black letters on yellow',
    positions: ['front of the vehicle', 'rear of the load'],
    escortSign: { text: 'OVERSIZE LOAD', minWidthIn: 5 * FT, minHeightIn: 12, letterHeightIn: 8 },
    source,
  };
}

const FEDERAL_LAMPS_SOURCE = ref(
  '49 CFR 393.11 Table 1 (projecting loads), secondary summary',
  'footnote text not read; lamp rules held as rulebook data until 393.11 itself is read',
);

/** The federal rules alone: 23 U.S.C. 127, 23 CFR 658, 49 CFR 393.87 / 393.11. No state permit, escort or travel rules. */
export const FEDERAL_DEFAULT_RULE: JurisdictionRule = {
  code: 'US',
  name: 'Federal (National Network)',
  sample: true,
  asOf: RULEBOOK_AS_OF,
  legal: {
    widthIn: 102,
    heightIn: 13 * FT + 6,
    lengthIn: 75 * FT,
    frontOverhangIn: null,
    rearOverhangIn: null,
    singleAxleLb: 20_000,
    tandemLb: 34_000,
    grossLb: 80_000,
    bridgeFormula: true,
    tandemPairMinFt: 36,
    bridgeTie: 'down',
    source: ref('23 U.S.C. 127(a)'),
    dimensionSources: {
      width: ref('23 CFR 658.15', '102 in on the National Network (Hawaii 108 in); cargo counts toward width'),
      height: sample('no federal height limit; 13 ft 6 in used as a common state limit'),
      length: sample('no federal overall length limit for this combination; 75 ft used as a placeholder'),
      overhangs: sample('no federal overhang limit'),
    },
  },
  permit: { validityDays: 5, leadTimeDays: 2, source: sample('permits are issued by the states') },
  escorts: { rules: [], twoDimensionRule: null, heightPole: null },
  signs: [oversizeSign(sample('sign size by the NY/MD convention (17 NYCRR 154-1.13; COMAR 11.04.04.01); applied by default as sample data'))],
  flags: [],
  lamps: [
    {
      when: [{ measure: 'rearOverhang', atLeast: 4 * FT }],
      lamps: [{ position: 'extreme rear of the load', color: 'red', count: 1 }],
      note: 'at night',
      source: FEDERAL_LAMPS_SOURCE,
    },
    {
      when: [{ measure: 'sideProjection', over: 4 }],
      lamps: [
        { position: 'front of the side projection', color: 'amber', count: 1 },
        { position: 'rear of the side projection', color: 'red', count: 1 },
      ],
      note: 'at night, on each projecting side',
      source: FEDERAL_LAMPS_SOURCE,
    },
  ],
  travel: {
    daylight: null,
    weekends: { allowed: true, source: sample('no federal travel-time rule') },
    holidays: { names: [], from: 'day-only', observance: 'both', source: sample('no federal travel-time rule') },
    curfews: [],
  },
  fee: { baseUsd: 0, source: sample('no federal permit fee; permits are issued by the states') },
  superload: { source: sample('superload thresholds are set by each state') },
};

type StateOverrides = Partial<Omit<JurisdictionRule, 'legal'>> & { legal?: Partial<JurisdictionRule['legal']> };

/** A state record whose unverified parts are sample data; verified parts are passed in with their citations. */
function stateRule(code: string, name: string, o: StateOverrides): JurisdictionRule {
  const s = (what: string): RuleSource => sample(`${name}: ${what} not read in a published source`);
  const base: JurisdictionRule = {
    code,
    name,
    sample: true,
    asOf: RULEBOOK_AS_OF,
    legal: {
      ...FEDERAL_DEFAULT_RULE.legal,
      heightIn: 13 * FT + 6,
      lengthIn: 75 * FT,
      frontOverhangIn: 3 * FT,
      rearOverhangIn: 4 * FT,
      source: ref('23 U.S.C. 127(a)', 'federal weights; state routes may differ'),
      dimensionSources: {
        width: ref('23 CFR 658.15', 'National Network width; state routes may differ'),
        height: s('legal height'),
        length: s('legal length'),
        overhangs: s('legal overhangs'),
      },
    },
    permit: { validityDays: 5, leadTimeDays: 2, source: s('permit validity and lead time') },
    escorts: { rules: [], twoDimensionRule: null, heightPole: null },
    signs: [oversizeSign(s('sign rule'))],
    flags: [
      {
        kind: 'corners',
        when: [],
        whenOversize: true,
        minCount: 4,
        minSquareIn: 18,
        colors: 'red or orange fluorescent',
        source: s('corner flags on oversize loads'),
      },
    ],
    lamps: [],
    travel: {
      daylight: { startOffsetMin: -30, endOffsetMin: 30, source: s('daylight travel hours') },
      weekends: { allowed: true, source: s('weekend travel') },
      holidays: { names: [...SIX_HOLIDAYS], from: 'day-only', observance: 'both', source: s('holiday list') },
      curfews: [],
    },
    fee: { baseUsd: 30, source: s('fee formula') },
    superload: { widthOverIn: 16 * FT, heightOverIn: 16 * FT, lengthOverIn: 125 * FT, grossOverLb: 200_000, source: s('superload thresholds') },
  };
  return { ...base, ...o, legal: { ...base.legal, ...o.legal } } as JurisdictionRule;
}

const TX_ESC = ref('TxDMV "Escort and Equipment Requirements"');
const txEscorts: EscortRule[] = [
  { when: { measure: 'width', over: 14 * FT }, roads: ['two-lane'], front: 1, rear: 0, source: TX_ESC },
  { when: { measure: 'width', over: 14 * FT }, roads: DIVIDED, front: 0, rear: 1, source: TX_ESC },
  { when: { measure: 'width', over: 16 * FT }, roads: ALL_ROADS, front: 1, rear: 1, source: TX_ESC },
  { when: { measure: 'height', over: 17 * FT }, roads: ALL_ROADS, front: 1, rear: 0, heightPole: true, source: TX_ESC },
  { when: { measure: 'height', over: 18 * FT }, roads: ALL_ROADS, front: 1, rear: 1, heightPole: true, source: TX_ESC },
  { when: { measure: 'length', over: 110 * FT }, roads: ['two-lane'], front: 1, rear: 0, source: TX_ESC },
  { when: { measure: 'length', over: 110 * FT }, roads: DIVIDED, front: 0, rear: 1, source: TX_ESC },
  { when: { measure: 'length', over: 125 * FT }, roads: ALL_ROADS, front: 1, rear: 1, source: TX_ESC },
  { when: { measure: 'frontOverhang', over: 20 * FT }, roads: ['two-lane'], front: 1, rear: 0, source: TX_ESC },
  { when: { measure: 'frontOverhang', over: 20 * FT }, roads: DIVIDED, front: 0, rear: 1, source: TX_ESC },
  { when: { measure: 'rearOverhang', over: 20 * FT }, roads: ALL_ROADS, front: 0, rear: 1, source: TX_ESC },
];

export const SAMPLE_RULE_TX: JurisdictionRule = stateRule('TX', 'Texas', {
  legal: { heightIn: 14 * FT },
  escorts: {
    rules: txEscorts,
    twoDimensionRule: { exceptPairs: [['length', 'frontOverhang'], ['length', 'rearOverhang']], source: TX_ESC },
    heightPole: { marginIn: 3, source: sample('Texas: height pole margin not read in a published source') },
  },
  flags: [
    {
      kind: 'overhang',
      when: [{ measure: 'rearOverhang', atLeast: 4 * FT }],
      minCount: 1,
      minSquareIn: 12,
      colors: 'red',
      source: ref('Tex. Transp. Code 547.382', 'by day'),
    },
    {
      kind: 'corners',
      when: [],
      whenOversize: true,
      minCount: 4,
      minSquareIn: 18,
      colors: 'red or orange fluorescent',
      source: sample('Texas: corner flags on oversize loads not read in a published source'),
    },
  ],
  lamps: [
    {
      when: [{ measure: 'rearOverhang', atLeast: 4 * FT }],
      lamps: [
        { position: 'rear of the load', color: 'red', count: 2, visibleFt: 500 },
        { position: 'sides of the projecting load', color: 'red', count: 2, visibleFt: 500 },
      ],
      reflectors: [{ position: 'rear of the load', color: 'red', count: 2 }],
      note: 'at night',
      source: ref('Tex. Transp. Code 547.382'),
    },
  ],
  travel: {
    daylight: { startOffsetMin: -30, endOffsetMin: 30, source: ref('Tex. Transp. Code 541.401', 'daytime = 30 min before sunrise to 30 min after sunset') },
    weekends: { allowed: true, source: sample('Texas: weekend travel not read in a published source') },
    holidays: { names: [...SIX_HOLIDAYS], from: 'day-only', observance: 'both', source: sample('Texas: holiday list not read in a published source') },
    curfews: [
      {
        start: '07:00',
        end: '09:00',
        days: [1, 2, 3, 4, 5],
        appliesIn: 'urban',
        source: sample('Texas: urban curfews are set per city; not read in a published source'),
      },
      {
        start: '16:00',
        end: '18:00',
        days: [1, 2, 3, 4, 5],
        appliesIn: 'urban',
        source: sample('Texas: urban curfews are set per city; not read in a published source'),
      },
    ],
  },
  fee: {
    baseUsd: 60,
    weightBrackets: [
      { overLb: 80_000, upToLb: 120_000, feeUsd: 150 },
      { overLb: 120_000, upToLb: 160_000, feeUsd: 225 },
      { overLb: 160_000, upToLb: 200_000, feeUsd: 300 },
      { overLb: 200_000, feeUsd: 375 },
    ],
    refundable: false,
    source: ref('43 TAC 219.13', 'single trip $60 plus highway maintenance fee by gross; non-refundable'),
  },
  superload: {
    widthOverIn: 20 * FT,
    heightOverIn: 18 * FT + 11,
    lengthOverIn: 125 * FT,
    grossOverLb: 254_300,
    source: sample('Texas: superload thresholds not read in a published source'),
  },
});

const VA_ESC = ref('24VAC20-81-180');
const VA_TRAVEL = ref('24VAC20-82-110');
export const SAMPLE_RULE_VA: JurisdictionRule = stateRule('VA', 'Virginia', {
  escorts: {
    rules: [
      { when: { measure: 'width', over: 12 * FT }, roads: NON_INTERSTATE, front: 1, rear: 1, source: VA_ESC },
      { when: { measure: 'width', over: 12 * FT }, roads: ['interstate'], front: 0, rear: 1, source: VA_ESC },
      { when: { measure: 'width', over: 14 * FT }, roads: NON_INTERSTATE, front: 2, rear: 1, source: VA_ESC },
      { when: { measure: 'width', over: 14 * FT }, roads: ['interstate'], front: 1, rear: 1, source: VA_ESC },
      { when: { measure: 'width', over: 16 * FT }, roads: NON_INTERSTATE, front: 2, rear: 2, source: VA_ESC },
      { when: { measure: 'width', over: 16 * FT }, roads: ['interstate'], front: 1, rear: 2, source: VA_ESC },
      { when: { measure: 'height', over: 14 * FT + 5 }, roads: ALL_ROADS, front: 1, rear: 0, heightPole: true, source: VA_ESC },
    ],
    twoDimensionRule: null,
    heightPole: { marginIn: 3, source: VA_ESC },
  },
  travel: {
    daylight: { startOffsetMin: 0, endOffsetMin: 0, source: VA_TRAVEL },
    weekends: { allowed: true, source: sample('Virginia: weekend travel not read in a published source') },
    holidays: { names: [...SIX_HOLIDAYS], from: 'noon-weekday-before', observance: 'both', source: VA_TRAVEL },
    curfews: [
      { start: '07:00', end: '09:00', appliesIn: 'urban', exempt: { overweightOnly: true, overlengthOnlyMaxIn: 85 * FT }, source: VA_TRAVEL },
      { start: '16:00', end: '18:00', appliesIn: 'urban', exempt: { overweightOnly: true, overlengthOnlyMaxIn: 85 * FT }, source: VA_TRAVEL },
    ],
  },
});

export const SAMPLE_RULE_PA: JurisdictionRule = stateRule('PA', 'Pennsylvania', {
  legal: {
    bridgeTie: 'up',
    source: ref('23 U.S.C. 127(a); 67 Pa. Code 185.3', 'the state table rounds exact ties up'),
  },
  fee: {
    baseUsd: 0,
    widthTiers: [{ upToIn: 14 * FT, feeUsd: 25 }, { feeUsd: 50 }],
    tonMile: { usdPerTonMile: 0.03, overRegisteredGross: true },
    source: ref('75 Pa.C.S. 1942', '$25 up to 14 ft wide, $50 above; overweight adds 3 cents per ton-mile over the registered gross'),
  },
});

export const SAMPLE_RULE_OH: JurisdictionRule = stateRule('OH', 'Ohio', {
  fee: {
    baseUsd: 20,
    weightBrackets: [
      { overLb: 80_000, upToLb: 120_000, feeUsd: 125 },
      { overLb: 120_000, feeUsd: 125 },
    ],
    tonMile: { usdPerTonMile: 0.04, overLb: 120_000, appliesAboveLb: 120_000 },
    dimensionTiers: [{ maxWidthIn: 14 * FT, maxHeightIn: 14 * FT + 6, feeUsd: 55 }, { feeUsd: 125 }],
    source: ref('OAC 5501:2-1-05'),
  },
});

export const SAMPLE_RULE_MD: JurisdictionRule = stateRule('MD', 'Maryland', {
  signs: [
    {
      ...oversizeSign(ref('COMAR 11.04.04.01', 'signs above 9 ft width; letters 1 5/8 in stroke'), 1.625),
      when: [{ measure: 'width', over: 9 * FT }],
      whenOversize: false,
    },
  ],
});

export const SAMPLE_RULE_NY: JurisdictionRule = stateRule('NY', 'New York', {
  signs: [oversizeSign(ref('17 NYCRR 154-1.13', 'sign on oversize loads; letters 1.41 in stroke'), 1.41)],
});

const FL_ESC = ref('Florida escort summary (university T2 program), secondary source', 'escort positions are sample data');
export const SAMPLE_RULE_FL: JurisdictionRule = stateRule('FL', 'Florida', {
  legal: { source: ref('23 U.S.C. 127(a); Fla. Stat. 316.535', 'L measured to the nearest foot') },
  escorts: {
    rules: [
      { when: { measure: 'width', over: 12 * FT }, roads: ALL_ROADS, front: 1, rear: 0, source: FL_ESC },
      { when: { measure: 'width', over: 14 * FT }, roads: ALL_ROADS, front: 1, rear: 1, source: FL_ESC },
      { when: { measure: 'height', over: 14 * FT + 6 }, roads: ALL_ROADS, front: 1, rear: 0, heightPole: true, source: FL_ESC },
      { when: { measure: 'length', over: 95 * FT }, roads: ALL_ROADS, front: 0, rear: 1, source: FL_ESC },
    ],
    twoDimensionRule: null,
    heightPole: { marginIn: 3, source: sample('Florida: height pole margin not read in a published source') },
  },
});

const WA_TRAVEL = ref('WAC 468-38-175');
export const SAMPLE_RULE_WA: JurisdictionRule = stateRule('WA', 'Washington', {
  legal: { heightIn: 14 * FT },
  travel: {
    daylight: { startOffsetMin: -30, endOffsetMin: 30, source: sample('Washington: daylight hours not read in a published source') },
    weekends: { allowed: true, source: sample('Washington: weekend travel not read in a published source') },
    holidays: { names: [...SIX_HOLIDAYS, 'day-after-thanksgiving'], from: 'noon-day-before', observance: 'both', source: WA_TRAVEL },
    curfews: [],
    minVisibilityFt: { value: 500, source: WA_TRAVEL },
  },
});

/** Sample rulebook records by postal code (plus `US`, the federal default). */
export const SAMPLE_RULES: Record<string, JurisdictionRule> = {
  US: FEDERAL_DEFAULT_RULE,
  TX: SAMPLE_RULE_TX,
  VA: SAMPLE_RULE_VA,
  PA: SAMPLE_RULE_PA,
  OH: SAMPLE_RULE_OH,
  MD: SAMPLE_RULE_MD,
  NY: SAMPLE_RULE_NY,
  FL: SAMPLE_RULE_FL,
  WA: SAMPLE_RULE_WA,
};
