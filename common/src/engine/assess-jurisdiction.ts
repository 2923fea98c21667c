/** Per-jurisdiction assessment: permit needed and why, escorts, signs, flags, lamps, fee, superload. */
import { AxleCheckResult, AxleInput, checkAxleWeights } from './axle-weights';
import {
  EscortRule,
  JurisdictionRule,
  MEASURE_LABELS,
  Measure,
  MeasuredLoad,
  RoadType,
  cite,
  dimensionsOverLegal,
  measureValue,
  triggerFires,
} from './jurisdiction-rule';
import { MarkingsResult, projectingLoadMarkings } from './markings';
import { FeeEstimate, estimatePermitFee } from './permit-fee';
import { PLANNING_CAUTION, RULEBOOK_CAUTION, Reason, RuleSource } from './reasons';
import { formatFeetInches, formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

export type AssessmentInput = {
  dimensions: MeasuredLoad & { rearProjectionWidthIn?: number; sideProjectionLeftIn?: number; sideProjectionRightIn?: number };
  /** Axles front to rear (positions from the steer axle); omit to check the gross only. */
  axles?: AxleInput[];
  /** Miles in this jurisdiction. */
  miles: number;
  /** Road classes used in this jurisdiction. */
  roadTypes: RoadType[];
  registeredGrossLb?: number;
};

export type EscortByRoad = { roadType: RoadType; front: number; rear: number; heightPole: boolean; reasons: Reason[] };

export type EscortRequirement = {
  /** Largest requirement over the road types travelled. */
  front: number;
  rear: number;
  heightPole: boolean;
  /** Height pole setting (load height + the rule's margin), when a pole is required. */
  heightPoleSetIn: number | null;
  byRoadType: EscortByRoad[];
  reasons: Reason[];
};

export type JurisdictionAssessment = {
  code: string;
  name: string;
  sample: boolean;
  asOf: string;
  permitRequired: boolean;
  /** Which limit, by how much. */
  permitReasons: Reason[];
  oversize: boolean;
  overweight: boolean;
  axleCheck: AxleCheckResult | null;
  escorts: EscortRequirement;
  markings: MarkingsResult;
  fee: FeeEstimate | null;
  superload: { isSuperload: boolean; reasons: Reason[] };
  permit: { validityDays: number; leadTimeDays: number; source: string };
  cautions: string[];
};

const reasonFrom = (code: string, message: string, src: RuleSource, extra: Partial<Reason> = {}): Reason => ({
  code,
  message,
  source: cite(src),
  ...(src.sample ? { sample: true } : {}),
  ...extra,
});

const unitOf = (m: Measure): 'lb' | 'in' => (m === 'gross' ? 'lb' : 'in');
const show = (m: Measure, v: number): string => (m === 'gross' ? formatPounds(v) : formatFeetInches(v));

/** Escorts the rule asks for on one road type. Per measure, the highest threshold crossed governs. */
export function escortsForRoad(rule: JurisdictionRule, m: MeasuredLoad, roadType: RoadType): EscortByRoad {
  const chosen = new Map<Measure, EscortRule>();
  for (const r of rule.escorts.rules) {
    if (!r.roads.includes(roadType) || !triggerFires(r.when, m)) continue;
    const prev = chosen.get(r.when.measure);
    const th = r.when.over ?? r.when.atLeast ?? 0;
    if (!prev || th > (prev.when.over ?? prev.when.atLeast ?? 0)) chosen.set(r.when.measure, r);
  }
  let front = 0;
  let rear = 0;
  let heightPole = false;
  const reasons: Reason[] = [];
  for (const [measure, r] of chosen) {
    front = Math.max(front, r.front);
    rear = Math.max(rear, r.rear);
    heightPole = heightPole || r.heightPole === true;
    const th = r.when.over ?? r.when.atLeast ?? 0;
    reasons.push(
      reasonFrom(
        `escort-${measure}`,
        `${rule.name}, ${roadType}: ${MEASURE_LABELS[measure]} ${show(measure, measureValue(measure, m))} ${r.when.over !== undefined ? 'over' : 'at least'} ${show(
          measure,
          th,
        )} → ${r.front} front, ${r.rear} rear${r.heightPole ? ', front escort with height pole' : ''}`,
        r.source,
        { value: measureValue(measure, m), limit: th, unit: unitOf(measure) },
      ),
    );
  }
  const two = rule.escorts.twoDimensionRule;
  if (two && chosen.size >= 2) {
    const measures = [...chosen.keys()];
    const excepted = (a: Measure, b: Measure): boolean => two.exceptPairs.some(([x, y]) => (x === a && y === b) || (x === b && y === a));
    let applies = false;
    for (let i = 0; i < measures.length && !applies; i++) {
      for (let j = i + 1; j < measures.length; j++) if (!excepted(measures[i], measures[j])) applies = true;
    }
    if (applies && (front < 1 || rear < 1)) {
      front = Math.max(front, 1);
      rear = Math.max(rear, 1);
      reasons.push(
        reasonFrom(
          'escort-two-dimensions',
          `${rule.name}, ${roadType}: over escort limits in ${measures.map((x) => MEASURE_LABELS[x]).join(' and ')} → front and rear escorts`,
          two.source,
        ),
      );
    }
  }
  return { roadType, front, rear, heightPole, reasons };
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

  const permitReasons: Reason[] = [];
  const over = dimensionsOverLegal(rule.legal, m);
  for (const o of over) {
    permitReasons.push(
      reasonFrom(
        `over-legal-${o.measure}`,
        `${MEASURE_LABELS[o.measure]} ${formatFeetInches(o.value)} is over the legal ${formatFeetInches(o.limit)} by ${formatFeetInches(o.overBy)}`,
        o.source,
        { value: o.value, limit: o.limit, unit: 'in' },
      ),
    );
  }
  const L = rule.legal;
  let axleCheck: AxleCheckResult | null = null;
  let overweight = false;
  if (input.axles && input.axles.length > 0) {
    axleCheck = checkAxleWeights(input.axles, {
      singleAxleLb: L.singleAxleLb,
      tandemLb: L.tandemLb,
      grossLb: L.grossLb,
      bridgeFormula: L.bridgeFormula,
      tandemPairMinFt: L.tandemPairMinFt,
      bridgeTie: L.bridgeTie,
      source: cite(L.source),
    });
    overweight = !axleCheck.legal;
    for (const v of axleCheck.violations) {
      permitReasons.push(reasonFrom(`overweight-${v.rule}`, v.message, L.source, { value: v.weightLb, limit: v.limitLb, unit: 'lb' }));
    }
  } else if (m.grossLb > L.grossLb) {
    overweight = true;
    permitReasons.push(
      reasonFrom('overweight-gross', `gross ${formatPounds(m.grossLb)} is over the legal ${formatPounds(L.grossLb)} by ${formatPounds(m.grossLb - L.grossLb)}`, L.source, {
        value: m.grossLb,
        limit: L.grossLb,
        unit: 'lb',
      }),
    );
  }
  const oversize = over.length > 0;
  const permitRequired = oversize || overweight;

  const byRoadType = [...new Set(input.roadTypes)].map((rt) => escortsForRoad(rule, m, rt));
  const front = Math.max(0, ...byRoadType.map((b) => b.front));
  const rear = Math.max(0, ...byRoadType.map((b) => b.rear));
  const heightPole = byRoadType.some((b) => b.heightPole);
  const pole = rule.escorts.heightPole;
  const escortReasons = byRoadType.flatMap((b) => b.reasons);
  if (heightPole) {
    escortReasons.push(
      pole
        ? reasonFrom('height-pole', `set the height pole ${formatFeetInches(pole.marginIn)} above the load: ${formatFeetInches(m.heightIn + pole.marginIn)}`, pole.source, {
            value: m.heightIn + pole.marginIn,
            unit: 'in',
          })
        : { code: 'height-pole', message: `set the height pole above the load height ${formatFeetInches(m.heightIn)} (no margin on file)`, source: cite(rule.escorts.rules[0].source) },
    );
  }
  const escorts: EscortRequirement = {
    front,
    rear,
    heightPole,
    heightPoleSetIn: heightPole ? m.heightIn + (pole?.marginIn ?? 0) : null,
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
  );

  const fee = permitRequired
    ? estimatePermitFee(rule.fee, {
        grossLb: m.grossLb,
        widthIn: m.widthIn,
        heightIn: m.heightIn,
        lengthIn: m.lengthIn,
        miles,
        ...(input.registeredGrossLb !== undefined ? { registeredGrossLb: input.registeredGrossLb } : {}),
        oversize,
        overweight,
      })
    : null;

  const sl = rule.superload;
  const slReasons: Reason[] = [];
  const slCheck = (measure: Measure, value: number, limit: number | undefined): void => {
    if (limit !== undefined && value > limit) {
      slReasons.push(reasonFrom(`superload-${measure}`, `${MEASURE_LABELS[measure]} ${show(measure, value)} is over the superload threshold ${show(measure, limit)}`, sl.source, {
        value,
        limit,
        unit: unitOf(measure),
      }));
    }
  };
  slCheck('width', m.widthIn, sl.widthOverIn);
  slCheck('height', m.heightIn, sl.heightOverIn);
  slCheck('length', m.lengthIn, sl.lengthOverIn);
  slCheck('gross', m.grossLb, sl.grossOverLb);

  if (!permitRequired) {
    permitReasons.push({ code: 'within-legal', message: `${rule.name}: within legal dimensions and weights; no permit needed`, source: cite(L.source) });
  }
  return {
    code: rule.code,
    name: rule.name,
    sample: rule.sample,
    asOf: rule.asOf,
    permitRequired,
    permitReasons,
    oversize,
    overweight,
    axleCheck,
    escorts,
    markings,
    fee,
    superload: { isSuperload: slReasons.length > 0, reasons: slReasons },
    permit: { validityDays: rule.permit.validityDays, leadTimeDays: rule.permit.leadTimeDays, source: cite(rule.permit.source) },
    cautions: [PLANNING_CAUTION, RULEBOOK_CAUTION],
  };
}
