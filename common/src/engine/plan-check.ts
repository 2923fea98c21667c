/** The full plan check: dimensions, axle loads and limits, securement, markings, jurisdictions, travel windows. */
import { AxleGroupLoadsResult, SliderRange, SliderSuggestion, TractorAxleGeometry, axleGroupLoads, combinationAxles, suggestSliderPosition } from './axle-group-loads';
import { AxleCheckResult, AxleInput, checkAxleWeights } from './axle-weights';
import { JurisdictionAssessment, OpenQuestion, assessJurisdiction } from './assess-jurisdiction';
import { DeckSection, DimensionsResult, PlacedArticle, overallDimensions } from './dimensions';
import { JurisdictionRule, RoadType } from './jurisdiction-rule';
import { MarkingsResult, projectingLoadMarkings } from './markings';
import { PLANNING_CAUTION, RULEBOOK_CAUTION, Reason, SOURCES } from './reasons';
import { blankRecord } from '../rulebook/blank-record';
import { jurisdictionByCode } from '../geo/jurisdictions';
import { SecurementResult, TiedownSpec, checkSecurement } from './securement';
import { TravelWindowsResult, travelWindows } from './travel-windows';
import { PermitGovernance, PermitTerms, governedTravelRules, permitGovernance } from './permit-terms';
import { ABSURD, checkNumber } from './validate';

export type PlanTractor = TractorAxleGeometry & {
  /** Front bumper to the steer axle. */
  bumperToSteerIn: number;
  widthIn: number;
  heightIn: number;
  /** Drive axles relative to the drive-group center, front to rear (e.g. [-2.1, 2.1] for a tandem). */
  driveAxleOffsetsFt: number[];
};

export type PlanTrailer = {
  tareLb: number;
  tareCgFromKingpinFt: number;
  /** Trailer axle-group center behind the kingpin. */
  axleGroupFromKingpinFt: number;
  /** Trailer axles relative to the group center, front to rear. */
  axleOffsetsFt: number[];
  kingpinFromFrontIn: number;
  lengthIn: number;
  widthIn: number;
  heightIn?: number;
  decks: DeckSection[];
  /** Sliding axle range; when given, the check suggests a setting. */
  slider?: SliderRange;
};

export type PlanArticle = PlacedArticle & {
  id: string;
  description?: string;
  weightLb: number;
  /** Center of gravity behind the article's front (default: half its length). */
  cgFromFrontIn?: number;
  blockedForward: boolean;
  heavyEquipment?: boolean;
  sharpEdges?: boolean;
  tiedowns: TiedownSpec[];
};

export type RouteSegment = {
  /** Rulebook code, e.g. 'TX'. */
  jurisdiction: string;
  miles: number;
  roadType: RoadType;
  urban?: boolean;
  /** A point on the segment for sun times. */
  lat: number;
  lon: number;
  /** IANA zone of the segment. */
  timeZone: string;
};

export type PlanInput = {
  tractor: PlanTractor;
  trailer: PlanTrailer;
  articles: PlanArticle[];
  route: RouteSegment[];
  /** Planned travel days, `YYYY-MM-DD`. */
  travelDates: string[];
  /** Rulebook records (by code); a jurisdiction without one reads as every topic not on file. */
  rules: JurisdictionRule[];
  registeredGrossLb?: number;
  /** Issued permits' validity windows by jurisdiction code. */
  permitValidity?: Record<string, { from: string; to: string }>;
  /** Issued permits' recorded terms by jurisdiction code: they govern travel and escorts there. */
  permits?: Record<string, PermitTerms>;
};

export type JurisdictionPlanResult = JurisdictionAssessment & {
  miles: number;
  roadTypes: RoadType[];
  ruleFound: boolean;
  travel: TravelWindowsResult[];
  /** Set when an issued permit's terms govern this jurisdiction: what it decides and where it differs from the rulebook. */
  governedBy: PermitGovernance | null;
};

export type PlanCheckResult = {
  dimensions: DimensionsResult;
  axleLoads: AxleGroupLoadsResult;
  axles: AxleInput[];
  federal: AxleCheckResult;
  slider: SliderSuggestion | null;
  securement: (SecurementResult & { articleId: string })[];
  markings: MarkingsResult;
  jurisdictions: JurisdictionPlanResult[];
  summary: {
    permitsNeeded: string[];
    superloads: string[];
    maxEscortsFront: number;
    maxEscortsRear: number;
    /** Sum of the fees on file. */
    estimatedFeesUsd: number;
    /** Jurisdictions needing a permit whose fee is not on file (the total is then incomplete). */
    feesNotOnFile: string[];
    /** Jurisdictions whose escort answer is not on file for this load. */
    escortsNotOnFile: string[];
    /** Every topic this move needs that the rulebook has not on file, until a permit answers it. */
    openQuestions: OpenQuestion[];
    /** False when a travel topic of the origin is not on file on some planned day. */
    earliestDepartureKnown: boolean;
    /** First legal moment to leave, in the first jurisdiction of the route, over the planned dates. */
    earliestDeparture: string | null;
    problems: string[];
  };
  reasons: Reason[];
  cautions: string[];
};

const TRAVEL_TOPIC_LABELS: Record<string, string> = {
  daylight: 'travel hours',
  weekends: 'weekend travel',
  holidays: 'holiday travel limits',
  curfews: 'urban curfews',
};

/**
 * The escorts an issued permit asks replace the rulebook's for that jurisdiction (the permit governs); the
 * rulebook's open question on escorts is answered by it.
 */
function escortsFromPermit(a: JurisdictionAssessment, t: PermitTerms): JurisdictionAssessment {
  const e = t.escorts!;
  const heightPole = e.heightPole ?? a.escorts.heightPole;
  return {
    ...a,
    escorts: {
      ...a.escorts,
      known: true,
      unknownMeasures: [],
      front: e.front,
      rear: e.rear,
      heightPole,
      heightPoleSetIn: heightPole ? a.escorts.heightPoleSetIn : null,
      byRoadType: a.escorts.byRoadType.map((b) => ({ ...b, front: e.front, rear: e.rear, heightPole, known: true })),
      reasons: [
        { code: 'permit-escorts', message: `${t.label}: ${e.front} front and ${e.rear} rear escort(s)${heightPole ? ', height pole' : ''}`, source: `${t.label} (issued ${t.issuedOn})` },
        ...a.escorts.reasons.filter((r) => r.code !== 'escorts-not-on-file'),
      ],
    },
    openQuestions: a.openQuestions.filter((q) => q.topic !== 'escorts'),
  };
}

/** Runs the whole plan and returns every result with its reasons (live feedback in the browser, assessment on the server). */
export function planCheck(plan: PlanInput): PlanCheckResult {
  const { tractor, trailer, articles } = plan;
  if (!Array.isArray(articles)) throw new RangeError('articles must be an array');
  if (!Array.isArray(plan.route) || plan.route.length === 0) throw new RangeError('route must list at least one segment');
  if (!Array.isArray(plan.travelDates)) throw new RangeError('travelDates must be an array of YYYY-MM-DD dates');
  if (plan.travelDates.length > 60) throw new RangeError(`travelDates: at most 60 days (absurd value); got ${plan.travelDates.length}`);
  checkNumber('tractor.bumperToSteerIn', tractor.bumperToSteerIn, { min: 0, max: 240, unit: 'in' });
  const kingpinFromSteerFt = tractor.wheelbaseFt - tractor.fifthWheelAheadOfDriveFt;

  const dimensions = overallDimensions({
    tractor: { bumperToKingpinIn: tractor.bumperToSteerIn + kingpinFromSteerFt * 12, widthIn: tractor.widthIn, heightIn: tractor.heightIn },
    trailer: {
      kingpinFromFrontIn: trailer.kingpinFromFrontIn,
      lengthIn: trailer.lengthIn,
      widthIn: trailer.widthIn,
      decks: trailer.decks,
      ...(trailer.heightIn !== undefined ? { heightIn: trailer.heightIn } : {}),
    },
    articles,
  });

  const loads = articles.map((a, i) => ({
    weightLb: checkNumber(`articles[${i}].weightLb`, a.weightLb, { min: 0, minExclusive: true, max: ABSURD.weightLb, unit: 'lb' }),
    cgFromKingpinFt: (a.positionFromTrailerFrontIn + (a.cgFromFrontIn ?? a.lengthIn / 2) - trailer.kingpinFromFrontIn) / 12,
  }));
  const groupInput = {
    tractor,
    trailer: { tareLb: trailer.tareLb, tareCgFromKingpinFt: trailer.tareCgFromKingpinFt, axleGroupFromKingpinFt: trailer.axleGroupFromKingpinFt },
    loads,
  };
  const axleLoads = axleGroupLoads(groupInput);
  const layout = { driveAxleOffsetsFt: tractor.driveAxleOffsetsFt, trailerAxleOffsetsFt: trailer.axleOffsetsFt };
  const axles = combinationAxles(axleLoads, tractor, groupInput.trailer, layout);
  const federal = checkAxleWeights(axles);
  const slider = trailer.slider ? suggestSliderPosition({ ...groupInput, slider: trailer.slider, layout }) : null;

  const securement = articles.map((a) => ({
    articleId: a.id,
    ...checkSecurement({
      weightLb: a.weightLb,
      lengthFt: a.lengthIn / 12,
      blockedForward: a.blockedForward,
      ...(a.heavyEquipment !== undefined ? { heavyEquipment: a.heavyEquipment } : {}),
      ...(a.sharpEdges !== undefined ? { sharpEdges: a.sharpEdges } : {}),
      tiedowns: a.tiedowns,
    }),
  }));

  const measured = {
    widthIn: dimensions.widthIn,
    heightIn: dimensions.heightIn,
    lengthIn: dimensions.lengthIn,
    frontOverhangIn: dimensions.frontOverhangIn,
    rearOverhangIn: dimensions.rearOverhangIn,
    sideProjectionIn: dimensions.sideProjectionIn,
    sideProjectionLeftIn: dimensions.sideProjectionLeftIn,
    sideProjectionRightIn: dimensions.sideProjectionRightIn,
    rearProjectionWidthIn: dimensions.rearProjectionWidthIn,
    trailerLengthIn: trailer.lengthIn,
    grossLb: axleLoads.grossLb,
  };
  const markings = projectingLoadMarkings({
    sideProjectionIn: dimensions.sideProjectionIn,
    sideProjectionLeftIn: dimensions.sideProjectionLeftIn,
    sideProjectionRightIn: dimensions.sideProjectionRightIn,
    rearProjectionIn: dimensions.rearOverhangIn,
    rearProjectionWidthIn: dimensions.rearProjectionWidthIn,
    widthIn: dimensions.widthIn,
    heightIn: dimensions.heightIn,
    lengthIn: dimensions.lengthIn,
    frontOverhangIn: dimensions.frontOverhangIn,
    grossLb: axleLoads.grossLb,
  });

  // Jurisdictions in route order.
  const byCode = new Map<string, RouteSegment[]>();
  plan.route.forEach((s, i) => {
    if (typeof s.jurisdiction !== 'string' || s.jurisdiction === '') throw new RangeError(`route[${i}].jurisdiction must name a jurisdiction`);
    checkNumber(`route[${i}].miles`, s.miles, { min: 0, max: ABSURD.miles });
    const list = byCode.get(s.jurisdiction);
    if (list) list.push(s);
    else byCode.set(s.jurisdiction, [s]);
  });
  const rules = new Map(plan.rules.map((r) => [r.code, r]));
  const problems: string[] = [];
  const jurisdictions: JurisdictionPlanResult[] = [];
  for (const [code, segs] of byCode) {
    const found = rules.get(code);
    const rule = found ?? blankRecord(code, jurisdictionByCode(code)?.name ?? code, '1970-01-01', 'no rulebook record');
    if (!found) problems.push(`${code}: no rulebook record; every topic not on file`);
    const miles = segs.reduce((s, x) => s + x.miles, 0);
    const roadTypes = [...new Set(segs.map((s) => s.roadType))];
    const assessed = assessJurisdiction(rule, {
      dimensions: measured,
      axles,
      miles,
      roadTypes,
      ...(plan.registeredGrossLb !== undefined ? { registeredGrossLb: plan.registeredGrossLb } : {}),
    });
    const terms = plan.permits?.[code];
    const governance = terms ? permitGovernance(rule.travel, terms, assessed.escorts) : null;
    const assessment = terms?.escorts ? escortsFromPermit(assessed, terms) : assessed;
    const overLegal = assessment.permitReasons.filter((r) => r.code.startsWith('over-legal-')).map((r) => r.code);
    const load = {
      overweightOnly: assessment.overweight && !assessment.oversize,
      overlengthOnly: !assessment.overweight && overLegal.length === 1 && overLegal[0] === 'over-legal-length',
      widthIn: dimensions.widthIn,
      heightIn: dimensions.heightIn,
      lengthIn: dimensions.lengthIn,
      grossLb: axleLoads.grossLb,
      roadType: roadTypes[0],
    };
    const first = segs[0];
    const urban = segs.some((s) => s.urban === true);
    const validity = plan.permitValidity?.[code];
    const governed = terms ? governedTravelRules(rule.travel, terms) : null;
    const travel = plan.travelDates.map((date) =>
      travelWindows({
        date,
        lat: first.lat,
        lon: first.lon,
        timeZone: first.timeZone,
        rule: governed ? { ...rule, travel: governed.rules } : rule,
        urban,
        load,
        ...(validity ? { permitValidity: validity } : {}),
        ...(governed?.clockHours ? { clockHours: governed.clockHours } : {}),
      }),
    );
    if (plan.travelDates.length > 0 && travel.every((t) => !t.allowed)) problems.push(`${code}: no legal travel window on the planned dates`);
    const travelUnknown = [...new Set(travel.flatMap((t) => t.unknownTopics))];
    const openQuestions = [
      ...assessment.openQuestions,
      ...(assessment.permitRequired
        ? travelUnknown.map((topic) => ({ jurisdiction: code, topic: `travel.${topic}`, message: `${rule.name}: ${TRAVEL_TOPIC_LABELS[topic] ?? topic} not on file — check the permit` }))
        : []),
    ];
    jurisdictions.push({ ...assessment, openQuestions, miles, roadTypes, ruleFound: found !== undefined, travel, governedBy: governance });
  }

  for (const v of federal.violations) problems.push(`federal limit: ${v.message}`);
  for (const w of axleLoads.warnings) problems.push(w);
  for (const s of securement) if (!s.ok) problems.push(`securement of ${s.articleId}: ${s.findings.join('; ')}`);

  let earliestDeparture: string | null = null;
  const origin = jurisdictions[0];
  for (const t of origin?.travel ?? []) {
    for (const iv of t.intervals) if (earliestDeparture === null || iv.start < earliestDeparture) earliestDeparture = iv.start;
  }
  const estimatedFeesUsd = Math.round(jurisdictions.reduce((s, j) => s + (j.fee?.known ? j.fee.totalUsd * 100 : 0), 0)) / 100;
  const earliestDepartureKnown = (origin?.travel ?? []).every((t) => t.known);
  const reasons: Reason[] = [
    ...dimensions.reasons,
    ...axleLoads.reasons,
    ...federal.reasons,
    { code: 'plan-summary', message: `${jurisdictions.length} jurisdiction(s), ${articles.length} article(s), ${axles.length} axles`, source: SOURCES.practice },
  ];
  return {
    dimensions,
    axleLoads,
    axles,
    federal,
    slider,
    securement,
    markings,
    jurisdictions,
    summary: {
      permitsNeeded: jurisdictions.filter((j) => j.permitRequired).map((j) => j.code),
      superloads: jurisdictions.filter((j) => j.superload.isSuperload).map((j) => j.code),
      maxEscortsFront: Math.max(0, ...jurisdictions.map((j) => j.escorts.front)),
      maxEscortsRear: Math.max(0, ...jurisdictions.map((j) => j.escorts.rear)),
      estimatedFeesUsd,
      feesNotOnFile: jurisdictions.filter((j) => j.fee && !j.fee.known).map((j) => j.code),
      escortsNotOnFile: jurisdictions.filter((j) => j.permitRequired && !j.escorts.known).map((j) => j.code),
      openQuestions: jurisdictions.flatMap((j) => j.openQuestions),
      earliestDeparture,
      earliestDepartureKnown,
      problems,
    },
    reasons,
    cautions: [PLANNING_CAUTION, RULEBOOK_CAUTION],
  };
}
