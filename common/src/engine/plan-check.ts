/** The full plan check: dimensions, axle loads and limits, securement, markings, jurisdictions, travel windows. */
import { AxleGroupLoadsResult, SliderRange, SliderSuggestion, TractorAxleGeometry, axleGroupLoads, combinationAxles, suggestSliderPosition } from './axle-group-loads';
import { AxleCheckResult, AxleInput, checkAxleWeights } from './axle-weights';
import { JurisdictionAssessment, assessJurisdiction } from './assess-jurisdiction';
import { DeckSection, DimensionsResult, PlacedArticle, overallDimensions } from './dimensions';
import { JurisdictionRule, RoadType } from './jurisdiction-rule';
import { MarkingsResult, projectingLoadMarkings } from './markings';
import { PLANNING_CAUTION, RULEBOOK_CAUTION, Reason, SOURCES } from './reasons';
import { FEDERAL_DEFAULT_RULE } from './rulebook-samples';
import { SecurementResult, TiedownSpec, checkSecurement } from './securement';
import { TravelWindowsResult, travelWindows } from './travel-windows';
import { ABSURD, checkNumber } from './validate';

export type PlanTractor = TractorAxleGeometry & {
  /** Front bumper to the steer axle. */
  bumperToSteerIn: number;
  widthIn: number;
  heightIn: number;
  /** Drive axles relative to the drive-group centre, front to rear (e.g. [-2.1, 2.1] for a tandem). */
  driveAxleOffsetsFt: number[];
};

export type PlanTrailer = {
  tareLb: number;
  tareCgFromKingpinFt: number;
  /** Trailer axle-group centre behind the kingpin. */
  axleGroupFromKingpinFt: number;
  /** Trailer axles relative to the group centre, front to rear. */
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
  /** Centre of gravity behind the article's front (default: half its length). */
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
  /** Rulebook records (by code); jurisdictions without one fall back to the federal default. */
  rules: JurisdictionRule[];
  registeredGrossLb?: number;
  /** Issued permits' validity windows by jurisdiction code. */
  permitValidity?: Record<string, { from: string; to: string }>;
};

export type JurisdictionPlanResult = JurisdictionAssessment & {
  miles: number;
  roadTypes: RoadType[];
  ruleFound: boolean;
  travel: TravelWindowsResult[];
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
    estimatedFeesUsd: number;
    /** First legal moment to leave, in the first jurisdiction of the route, over the planned dates. */
    earliestDeparture: string | null;
    problems: string[];
  };
  reasons: Reason[];
  cautions: string[];
};

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
    const rule = found ?? { ...FEDERAL_DEFAULT_RULE, code, name: `${code} (no rulebook record: federal defaults)` };
    if (!found) problems.push(`${code}: no rulebook record; federal defaults used`);
    const miles = segs.reduce((s, x) => s + x.miles, 0);
    const roadTypes = [...new Set(segs.map((s) => s.roadType))];
    const assessment = assessJurisdiction(rule, {
      dimensions: measured,
      axles,
      miles,
      roadTypes,
      ...(plan.registeredGrossLb !== undefined ? { registeredGrossLb: plan.registeredGrossLb } : {}),
    });
    const overLegal = assessment.permitReasons.filter((r) => r.code.startsWith('over-legal-')).map((r) => r.code);
    const load = {
      overweightOnly: assessment.overweight && !assessment.oversize,
      overlengthOnly: !assessment.overweight && overLegal.length === 1 && overLegal[0] === 'over-legal-length',
      lengthIn: dimensions.lengthIn,
    };
    const first = segs[0];
    const urban = segs.some((s) => s.urban === true);
    const validity = plan.permitValidity?.[code];
    const travel = plan.travelDates.map((date) =>
      travelWindows({
        date,
        lat: first.lat,
        lon: first.lon,
        timeZone: first.timeZone,
        rule,
        urban,
        load,
        ...(validity ? { permitValidity: validity } : {}),
      }),
    );
    if (plan.travelDates.length > 0 && travel.every((t) => !t.allowed)) problems.push(`${code}: no legal travel window on the planned dates`);
    jurisdictions.push({ ...assessment, miles, roadTypes, ruleFound: found !== undefined, travel });
  }

  for (const v of federal.violations) problems.push(`federal limit: ${v.message}`);
  for (const w of axleLoads.warnings) problems.push(w);
  for (const s of securement) if (!s.ok) problems.push(`securement of ${s.articleId}: ${s.findings.join('; ')}`);

  let earliestDeparture: string | null = null;
  const origin = jurisdictions[0];
  for (const t of origin?.travel ?? []) {
    for (const iv of t.intervals) if (earliestDeparture === null || iv.start < earliestDeparture) earliestDeparture = iv.start;
  }
  const estimatedFeesUsd = Math.round(jurisdictions.reduce((s, j) => s + (j.fee ? j.fee.totalUsd * 100 : 0), 0)) / 100;
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
      earliestDeparture,
      problems,
    },
    reasons,
    cautions: [PLANNING_CAUTION, RULEBOOK_CAUTION],
  };
}
