/**
 * Per-jurisdiction assessment: permit needed and why, escorts, signs, flags, lamps, fee, superload — and, for every
 * topic the load needs that the rulebook has not on file, an open question (never read as "none").
 */
import { AxleCheckResult, AxleInput, checkAxleWeights } from './axle-weights';
import {
  ESCORT_MEASURES,
  EscortMeasure,
  EscortRule,
  Fact,
  JurisdictionRule,
  KnownFact,
  MEASURE_LABELS,
  Measure,
  MeasuredLoad,
  RoadType,
  cite,
  isKnown,
  measureValue,
  triggerFires,
  valueOf,
} from './jurisdiction-rule';
import { MarkingsResult, projectingLoadMarkings } from './markings';
import { FeeEstimate, FeeNotOnFile, estimatePermitFee } from './permit-fee';
import { NOT_ON_FILE, NOT_ON_FILE_SOURCE, PLANNING_CAUTION, RULEBOOK_CAUTION, Reason, SOURCES } from './reasons';
import { formatFeetInches, formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

export type AssessmentInput = {
  dimensions: MeasuredLoad & {
    rearProjectionWidthIn?: number;
    sideProjectionLeftIn?: number;
    sideProjectionRightIn?: number;
    /** The semitrailer's own length (an extended stretch deck), checked against the state's semitrailer limit. */
    trailerLengthIn?: number;
  };
  /** Axles front to rear (positions from the steer axle); omit to check the gross only. */
  axles?: AxleInput[];
  /** Miles in this jurisdiction. */
  miles: number;
  /** Road classes used in this jurisdiction. */
  roadTypes: RoadType[];
  registeredGrossLb?: number;
};

/** A topic the load needs that the rulebook has not on file. */
export type OpenQuestion = {
  jurisdiction: string;
  /** e.g. `escorts`, `fee`, `travel.daylight`, `legal.heightIn`, `signs`. */
  topic: string;
  message: string;
};

export type EscortByRoad = {
  roadType: RoadType;
  front: number;
  rear: number;
  heightPole: boolean;
  /** False when a measure this load needs is not on file: the counts are then a floor, not the answer. */
  known: boolean;
  reasons: Reason[];
};

export type EscortRequirement = {
  /** False when any escort rule this load needs is not on file. */
  known: boolean;
  /** Measures whose escort rules are not on file although the load needs them. */
  unknownMeasures: Measure[];
  /** Largest requirement over the road types travelled (a floor when `known` is false). */
  front: number;
  rear: number;
  heightPole: boolean;
  /** Height pole setting (load height + the rule's margin), when a pole is required and the margin is on file. */
  heightPoleSetIn: number | null;
  /** Law-enforcement escort asked for. */
  police: boolean;
  /** Accepted alternatives, in the text's words. */
  alternatives: string[];
  byRoadType: EscortByRoad[];
  reasons: Reason[];
};

export type JurisdictionAssessment = {
  code: string;
  name: string;
  asOf: string;
  permitRequired: boolean;
  /** False when no known limit asks for a permit but a limit the load may exceed is not on file. */
  permitKnown: boolean;
  /** Which limit, by how much. */
  permitReasons: Reason[];
  oversize: boolean;
  overweight: boolean;
  axleCheck: AxleCheckResult | null;
  escorts: EscortRequirement;
  markings: MarkingsResult;
  /** Null when no permit is needed; `known: false` when the fee is not on file. */
  fee: FeeEstimate | FeeNotOnFile | null;
  superload: { isSuperload: boolean; known: boolean; reasons: Reason[] };
  permit: { validityDays: number | null; leadTimeDays: number | null; source: string };
  /** Every topic this load needs that is not on file for this jurisdiction. */
  openQuestions: OpenQuestion[];
  cautions: string[];
};

const reasonFrom = (code: string, message: string, f: KnownFact<unknown> | string, extra: Partial<Reason> = {}): Reason => ({
  code,
  message,
  source: typeof f === 'string' ? f : cite(f),
  ...extra,
});

const unitOf = (m: Measure): 'lb' | 'in' => (m === 'gross' ? 'lb' : 'in');
const show = (m: Measure, v: number): string => (m === 'gross' ? formatPounds(v) : formatFeetInches(v));

/** Federal width on the National Network: no state may set more or less (23 CFR 658.15). */
const FEDERAL_WIDTH_IN = 102;
/** Lowest legal height of any state (13 ft 6 in); a load at or under it cannot be over a state's legal height. Fact of the trade. */
const LOWEST_STATE_HEIGHT_IN = 162;

type LegalCheck = { over: Reason[]; unknown: OpenQuestion[]; oversizeMeasures: Set<Measure> };

/** Dimensions of the load over the jurisdiction's legal limits, and the limits not on file that the load may exceed. */
export function legalDimensionCheck(rule: JurisdictionRule, m: MeasuredLoad, trailerLengthIn?: number): LegalCheck {
  const L = rule.legal;
  const over: Reason[] = [];
  const unknown: OpenQuestion[] = [];
  const oversizeMeasures = new Set<Measure>();
  const q = (topic: string, what: string): void => {
    unknown.push({ jurisdiction: rule.code, topic, message: `${rule.name}: legal ${what} ${NOT_ON_FILE}` });
  };
  const check = (measure: Measure, value: number, f: Fact<number | null>, topic: string, mayExceed: boolean): void => {
    if (isKnown(f)) {
      if (f.value !== null && value > f.value + 1e-9) {
        oversizeMeasures.add(measure);
        over.push(
          reasonFrom(`over-legal-${measure}`, `${MEASURE_LABELS[measure]} ${formatFeetInches(value)} is over the legal ${formatFeetInches(f.value)} by ${formatFeetInches(value - f.value)}`, f, {
            value,
            limit: f.value,
            unit: 'in',
          }),
        );
      }
    } else if (mayExceed) q(topic, MEASURE_LABELS[measure]);
  };
  if (isKnown(L.widthIn)) check('width', m.widthIn, L.widthIn, 'legal.widthIn', true);
  else if (m.widthIn > FEDERAL_WIDTH_IN + 1e-9) {
    oversizeMeasures.add('width');
    over.push({
      code: 'over-legal-width',
      message: `width ${formatFeetInches(m.widthIn)} is over the federal National Network width ${formatFeetInches(FEDERAL_WIDTH_IN)} (${rule.name}'s own width limit ${NOT_ON_FILE})`,
      source: SOURCES.cfr658_15,
      value: m.widthIn,
      limit: FEDERAL_WIDTH_IN,
      unit: 'in',
    });
  }
  check('height', m.heightIn, L.heightIn, 'legal.heightIn', m.heightIn > LOWEST_STATE_HEIGHT_IN);
  check('length', m.lengthIn, L.overallLengthIn, 'legal.overallLengthIn', true);
  // where the state limits the semitrailer rather than the combination, a stretched deck is what makes it long
  const semi = L.semitrailerLengthIn;
  if (trailerLengthIn !== undefined && isKnown(semi) && semi.value !== null && trailerLengthIn > semi.value + 1e-9 && !oversizeMeasures.has('length')) {
    oversizeMeasures.add('length');
    over.push(
      reasonFrom('over-legal-length', `semitrailer ${formatFeetInches(trailerLengthIn)} is over the legal semitrailer length ${formatFeetInches(semi.value)} by ${formatFeetInches(trailerLengthIn - semi.value)}`, semi, {
        value: trailerLengthIn,
        limit: semi.value,
        unit: 'in',
      }),
    );
  }
  check('frontOverhang', m.frontOverhangIn, L.frontOverhangIn, 'legal.frontOverhangIn', m.frontOverhangIn > 0);
  check('rearOverhang', m.rearOverhangIn, L.rearOverhangIn, 'legal.rearOverhangIn', m.rearOverhangIn > 0);
  return { over, unknown, oversizeMeasures };
}

/** Whether an escort measure matters for this load when its rules are not on file. */
function escortMeasureNeeded(rule: JurisdictionRule, measure: EscortMeasure, d: AssessmentInput['dimensions'], oversize: Set<Measure>): boolean {
  switch (measure) {
    case 'height':
      return oversize.has('height') || (!isKnown(rule.legal.heightIn) && d.heightIn > LOWEST_STATE_HEIGHT_IN);
    case 'length':
      return oversize.has('length') || !isKnown(rule.legal.overallLengthIn);
    case 'sideProjection': {
      // off-center rules: only a load that projects unevenly
      const l = d.sideProjectionLeftIn;
      const r = d.sideProjectionRightIn;
      return l !== undefined && r !== undefined && Math.abs(l - r) > 1;
    }
    case 'frontOverhang':
      return d.frontOverhangIn > 0;
    case 'rearOverhang':
      return d.rearOverhangIn > 0;
    default:
      return oversize.has(measure);
  }
}

/** Escorts the rule asks for on one road type. Per measure, the highest threshold crossed governs. */
export function escortsForRoad(
  rule: JurisdictionRule,
  m: MeasuredLoad,
  roadType: RoadType,
  unknownMeasures: Measure[] = [],
): EscortByRoad & { police: boolean; alternatives: string[] } {
  const chosen = new Map<Measure, { r: EscortRule; f: KnownFact<EscortRule[]> }>();
  for (const measure of ESCORT_MEASURES) {
    const f = rule.escorts[measure];
    if (!isKnown(f)) continue;
    for (const r of f.value) {
      if (!r.roads.includes(roadType) || !triggerFires(r.when, m)) continue;
      const key = r.when.measure;
      const prev = chosen.get(key);
      const th = r.when.over ?? r.when.atLeast ?? 0;
      if (!prev || th > (prev.r.when.over ?? prev.r.when.atLeast ?? 0)) chosen.set(key, { r, f });
    }
  }
  let front = 0;
  let rear = 0;
  let heightPole = false;
  let police = false;
  const alternatives: string[] = [];
  const reasons: Reason[] = [];
  for (const [measure, { r, f }] of chosen) {
    front = Math.max(front, r.front);
    rear = Math.max(rear, r.rear);
    heightPole = heightPole || r.heightPole === true;
    police = police || r.police === true;
    if (r.alternative) alternatives.push(r.alternative);
    const th = r.when.over ?? r.when.atLeast ?? 0;
    const tm = r.when.measure;
    reasons.push(
      reasonFrom(
        `escort-${measure}`,
        `${rule.name}, ${roadType}: ${MEASURE_LABELS[tm]} ${show(tm, measureValue(tm, m))} ${r.when.over !== undefined ? 'over' : 'at least'} ${show(tm, th)} → ${r.front} front, ${r.rear} rear${
          r.heightPole ? ', front escort with height pole' : ''
        }${r.police ? ', law-enforcement escort' : ''}${r.alternative ? ` (or: ${r.alternative})` : ''}`,
        f,
        { value: measureValue(tm, m), limit: th, unit: unitOf(tm) },
      ),
    );
  }
  let known = unknownMeasures.length === 0;
  const two = rule.escorts.twoDimensionRule;
  if (chosen.size >= 2) {
    if (!isKnown(two)) known = false;
    else if (two.value) {
      const measures = [...chosen.keys()];
      const pairs = two.value.exceptPairs;
      const excepted = (a: Measure, b: Measure): boolean => pairs.some(([x, y]) => (x === a && y === b) || (x === b && y === a));
      let applies = false;
      for (let i = 0; i < measures.length && !applies; i++) {
        for (let j = i + 1; j < measures.length; j++) if (!excepted(measures[i], measures[j])) applies = true;
      }
      if (applies && (front < 1 || rear < 1)) {
        front = Math.max(front, 1);
        rear = Math.max(rear, 1);
        reasons.push(
          reasonFrom('escort-two-dimensions', `${rule.name}, ${roadType}: over escort limits in ${measures.map((x) => MEASURE_LABELS[x]).join(' and ')} → front and rear escorts`, two),
        );
      }
    }
  }
  return { roadType, front, rear, heightPole, known, reasons, police, alternatives };
}

/** Assesses one jurisdiction's rulebook record against the load: permit, escorts, markings, fee, superload. */
export function assessJurisdiction(rule: JurisdictionRule, input: AssessmentInput): JurisdictionAssessment {
  const d = input.dimensions;
  const m: MeasuredLoad = {
    widthIn: checkNumber('dimensions.widthIn', d.widthIn, { min: 0, max: ABSURD.widthIn, unit: 'in' }),
    heightIn: checkNumber('dimensions.heightIn', d.heightIn, { min: 0, max: ABSURD.heightIn, unit: 'in' }),
    lengthIn: checkNumber('dimensions.lengthIn', d.lengthIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' }),
    frontOverhangIn: checkNumber('dimensions.frontOverhangIn', d.frontOverhangIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' }),
    rearOverhangIn: checkNumber('dimensions.rearOverhangIn', d.rearOverhangIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' }),
    sideProjectionIn: checkNumber('dimensions.sideProjectionIn', d.sideProjectionIn, { min: 0, max: ABSURD.widthIn, unit: 'in' }),
    grossLb: checkNumber('dimensions.grossLb', d.grossLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' }),
  };
  const miles = checkNumber('miles', input.miles, { min: 0, max: ABSURD.miles });
  if (!Array.isArray(input.roadTypes) || input.roadTypes.length === 0) throw new RangeError('roadTypes must name at least one road type');
  const openQuestions: OpenQuestion[] = [];
  const ask = (topic: string, what: string): void => {
    openQuestions.push({ jurisdiction: rule.code, topic, message: `${rule.name}: ${what} ${NOT_ON_FILE}` });
  };

  const trailerLengthIn = d.trailerLengthIn === undefined ? undefined : checkNumber('dimensions.trailerLengthIn', d.trailerLengthIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
  const legalCheck = legalDimensionCheck(rule, m, trailerLengthIn);
  const permitReasons: Reason[] = [...legalCheck.over];

  // Weights: each of the state's own limits where on file; the federal Interstate limit for any not on file, said so.
  const L = rule.legal;
  const weightFacts: [string, Fact<unknown>][] = [
    ['single axle', L.singleAxleLb],
    ['tandem', L.tandemLb],
    ['gross', L.grossLb],
    ['bridge formula', L.bridge],
  ];
  const missingWeights = weightFacts.filter(([, f]) => !isKnown(f)).map(([what]) => what);
  const weightsKnown = missingWeights.length === 0;
  const bridge = valueOf(L.bridge);
  const weightSource = [
    ...new Set(weightFacts.flatMap(([, f]) => (isKnown(f) ? [cite(f)] : []))),
    ...(weightsKnown ? [] : [`${SOURCES.usc127} (federal Interstate limits for the ${missingWeights.join(', ')}: ${rule.name}'s own ${NOT_ON_FILE})`]),
  ].join('; ');
  const limits = {
    singleAxleLb: valueOf(L.singleAxleLb) ?? 20_000,
    tandemLb: valueOf(L.tandemLb) ?? 34_000,
    grossLb: valueOf(L.grossLb) ?? 80_000,
    bridgeFormula: bridge?.formula ?? true,
    tandemPairMinFt: bridge ? bridge.tandemPairMinFt : 36,
    bridgeTie: bridge?.tie ?? ('down' as const),
    source: weightSource,
  };
  let axleCheck: AxleCheckResult | null = null;
  let overweight = false;
  if (input.axles && input.axles.length > 0) {
    axleCheck = checkAxleWeights(input.axles, limits);
    overweight = !axleCheck.legal;
    for (const v of axleCheck.violations) {
      permitReasons.push(reasonFrom(`overweight-${v.rule}`, v.message, weightSource, { value: v.weightLb, limit: v.limitLb, unit: 'lb' }));
    }
  } else if (m.grossLb > limits.grossLb) {
    overweight = true;
    permitReasons.push(
      reasonFrom('overweight-gross', `gross ${formatPounds(m.grossLb)} is over the legal ${formatPounds(limits.grossLb)} by ${formatPounds(m.grossLb - limits.grossLb)}`, weightSource, {
        value: m.grossLb,
        limit: limits.grossLb,
        unit: 'lb',
      }),
    );
  }
  const oversize = legalCheck.oversizeMeasures.size > 0;
  const permitRequired = oversize || overweight;
  // a limit not on file only leaves the answer open when nothing on file already asks for a permit
  const permitKnown = permitRequired || legalCheck.unknown.length === 0;
  if (!permitRequired) openQuestions.push(...legalCheck.unknown);
  if (!weightsKnown && (overweight || m.grossLb > 80_000)) ask('legal.weights', `legal ${missingWeights.join(', ')} limits`);

  // Escorts, by measure: a measure the load needs whose rules are not on file leaves the answer open.
  const unknownMeasures: Measure[] = [];
  if (permitRequired) {
    for (const measure of ESCORT_MEASURES) {
      if (!isKnown(rule.escorts[measure]) && escortMeasureNeeded(rule, measure, d, legalCheck.oversizeMeasures)) unknownMeasures.push(measure);
    }
  }
  const roads = [...new Set(input.roadTypes)].map((rt) => escortsForRoad(rule, m, rt, unknownMeasures));
  const byRoadType: EscortByRoad[] = roads.map(({ police: _p, alternatives: _a, ...b }) => b);
  const front = Math.max(0, ...byRoadType.map((b) => b.front));
  const rear = Math.max(0, ...byRoadType.map((b) => b.rear));
  const heightPole = byRoadType.some((b) => b.heightPole);
  const escortsKnown = byRoadType.every((b) => b.known);
  const escortReasons = byRoadType.flatMap((b) => b.reasons);
  if (!escortsKnown) {
    const what = unknownMeasures.length ? ` for ${unknownMeasures.map((x) => MEASURE_LABELS[x]).join(', ')}` : ' for a load over limits in two measures';
    ask('escorts', `escorts${what}`);
    escortReasons.push({ code: 'escorts-not-on-file', message: `${rule.name}: escort rules${what} ${NOT_ON_FILE}`, source: NOT_ON_FILE_SOURCE });
  }
  const margin = rule.escorts.heightPoleMarginIn;
  if (heightPole) {
    if (isKnown(margin)) {
      escortReasons.push(
        reasonFrom('height-pole', `set the height pole ${formatFeetInches(margin.value)} above the load: ${formatFeetInches(m.heightIn + margin.value)}`, margin, {
          value: m.heightIn + margin.value,
          unit: 'in',
        }),
      );
    } else {
      ask('escorts.heightPoleMarginIn', 'height-pole margin');
      escortReasons.push({ code: 'height-pole', message: `set the height pole above the load height ${formatFeetInches(m.heightIn)}; margin ${NOT_ON_FILE}`, source: NOT_ON_FILE_SOURCE });
    }
  }
  const cert = rule.escorts.certification;
  if (front + rear > 0 && isKnown(cert) && cert.value) escortReasons.push(reasonFrom('escort-certification', `escort operators: ${cert.value}`, cert));
  const escorts: EscortRequirement = {
    known: escortsKnown,
    unknownMeasures,
    front,
    rear,
    heightPole,
    heightPoleSetIn: heightPole && isKnown(margin) ? m.heightIn + margin.value : null,
    police: roads.some((r) => r.police),
    alternatives: [...new Set(roads.flatMap((r) => r.alternatives))],
    byRoadType,
    reasons: escortReasons,
  };

  const markings = projectingLoadMarkings(
    {
      sideProjectionIn: m.sideProjectionIn,
      ...(d.sideProjectionLeftIn !== undefined ? { sideProjectionLeftIn: d.sideProjectionLeftIn } : {}),
      ...(d.sideProjectionRightIn !== undefined ? { sideProjectionRightIn: d.sideProjectionRightIn } : {}),
      rearProjectionIn: m.rearOverhangIn,
      rearProjectionWidthIn: d.rearProjectionWidthIn ?? (m.rearOverhangIn > 0 ? m.widthIn : 0),
      widthIn: m.widthIn,
      heightIn: m.heightIn,
      lengthIn: m.lengthIn,
      frontOverhangIn: m.frontOverhangIn,
      grossLb: m.grossLb,
    },
    rule,
    oversize,
  );
  if (oversize && markings.notOnFile) {
    if (markings.notOnFile.signs) ask('signs', 'signs');
    if (markings.notOnFile.flags) ask('flags', 'flags (the federal 49 CFR 393.87 flags are listed)');
    if (markings.notOnFile.lamps) ask('lamps', 'lamps (the federal 49 CFR 393.11 lamps are listed)');
  }

  let fee: FeeEstimate | FeeNotOnFile | null = null;
  if (permitRequired) {
    if (isKnown(rule.fee)) {
      fee = estimatePermitFee(
        rule.fee.value,
        {
          grossLb: m.grossLb,
          widthIn: m.widthIn,
          heightIn: m.heightIn,
          lengthIn: m.lengthIn,
          miles,
          ...(input.registeredGrossLb !== undefined ? { registeredGrossLb: input.registeredGrossLb } : {}),
          oversize,
          overweight,
        },
        cite(rule.fee),
      );
    } else {
      fee = { known: false, totalUsd: null, message: `${rule.name}: permit fee ${NOT_ON_FILE}` };
      ask('fee', 'permit fee');
    }
  }

  const slReasons: Reason[] = [];
  const sl = rule.superload;
  if (isKnown(sl)) {
    const slCheck = (measure: Measure, value: number, limit: number | undefined): void => {
      if (limit !== undefined && value > limit) {
        slReasons.push(reasonFrom(`superload-${measure}`, `${MEASURE_LABELS[measure]} ${show(measure, value)} is over the superload threshold ${show(measure, limit)}`, sl, { value, limit, unit: unitOf(measure) }));
      }
    };
    slCheck('width', m.widthIn, sl.value.widthOverIn);
    slCheck('height', m.heightIn, sl.value.heightOverIn);
    slCheck('length', m.lengthIn, sl.value.lengthOverIn);
    slCheck('gross', m.grossLb, sl.value.grossOverLb);
  } else if (permitRequired) ask('superload', 'superload thresholds');

  const validity = rule.permit.validityDays;
  const lead = rule.permit.leadTimeDays;
  if (permitRequired) {
    if (!isKnown(validity)) ask('permit.validityDays', 'permit validity');
    if (!isKnown(lead)) ask('permit.leadTimeDays', 'permit lead time');
  }

  if (!permitRequired) {
    permitReasons.push(
      permitKnown
        ? { code: 'within-legal', message: `${rule.name}: within legal dimensions and weights on file; no permit needed`, source: weightSource }
        : { code: 'permit-not-on-file', message: `${rule.name}: within the limits on file, but ${legalCheck.unknown.map((u) => u.topic.replace('legal.', '')).join(', ')} ${NOT_ON_FILE}`, source: NOT_ON_FILE_SOURCE },
    );
  }
  return {
    code: rule.code,
    name: rule.name,
    asOf: rule.asOf,
    permitRequired,
    permitKnown,
    permitReasons,
    oversize,
    overweight,
    axleCheck,
    escorts,
    markings,
    fee,
    superload: { isSuperload: slReasons.length > 0, known: isKnown(sl), reasons: slReasons },
    permit: {
      validityDays: valueOf(validity) ?? null,
      leadTimeDays: valueOf(lead) ?? null,
      source: [validity, lead].map((f) => (isKnown(f) ? cite(f) : NOT_ON_FILE)).filter((x, i, a) => a.indexOf(x) === i).join('; '),
    },
    openQuestions,
    cautions: [PLANNING_CAUTION, RULEBOOK_CAUTION],
  };
}
