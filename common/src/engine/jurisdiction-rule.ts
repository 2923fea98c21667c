/**
 * A rulebook record: one jurisdiction's limits and requirements, every part with its source and as-of date.
 * JSON-serialisable (stored as jsonb by the server). Lengths in inches, weights in pounds, times in minutes.
 */
import type { RuleSource } from './reasons';

/** Road classes an escort rule can name. `multilane` = divided / four or more lanes (not interstate). */
export type RoadType = 'two-lane' | 'multilane' | 'interstate';

/** Measures a trigger can look at. Lengths in inches, weights in pounds. */
export type Measure =
  | 'width'
  | 'height'
  | 'length'
  | 'frontOverhang'
  | 'rearOverhang'
  | 'sideProjection'
  | 'gross';

/** `over` is a strict threshold (value > over); `atLeast` an inclusive one (value ≥ atLeast). Give one. */
export type Trigger = { measure: Measure; over?: number; atLeast?: number };

export type LegalLimits = {
  widthIn: number;
  heightIn: number;
  lengthIn: number;
  frontOverhangIn: number | null;
  rearOverhangIn: number | null;
  singleAxleLb: number;
  tandemLb: number;
  grossLb: number;
  bridgeFormula: boolean;
  /** Two-tandem exception distance (36 ft federally); null = none. */
  tandemPairMinFt: number | null;
  bridgeTie: 'down' | 'up';
  /** Weights (axle, tandem, gross, bridge formula). */
  source: RuleSource;
  /** Sources of the dimension limits, which often come from different texts. */
  dimensionSources: { width: RuleSource; height: RuleSource; length: RuleSource; overhangs: RuleSource };
};

export type EscortRule = {
  /** The measure and threshold that asks for escorts. */
  when: Trigger;
  roads: RoadType[];
  front: number;
  rear: number;
  heightPole?: boolean;
  source: RuleSource;
};

export type EscortRules = {
  rules: EscortRule[];
  /**
   * A load over escort limits in two dimensions needs front and rear escorts, except when the pair is one of
   * `exceptPairs` (e.g. length and an overhang). Null when the jurisdiction has no such rule.
   */
  twoDimensionRule: { exceptPairs: [Measure, Measure][]; source: RuleSource } | null;
  /** The height pole is set this far above the load's height. */
  heightPole: { marginIn: number; source: RuleSource } | null;
};

export type SignRule = {
  /** Any of these triggers asks for the sign; `whenOversize` = any dimension over the legal limit. */
  when: Trigger[];
  whenOversize?: boolean;
  text: string;
  minWidthIn: number;
  minHeightIn: number;
  letterHeightIn: number;
  strokeIn?: number;
  colors: string;
  positions: string[];
  /** Sign on each escort vehicle. */
  escortSign?: { text: string; minWidthIn: number; minHeightIn: number; letterHeightIn: number };
  source: RuleSource;
};

export type FlagRule = {
  kind: 'corners' | 'width-extremities' | 'overhang';
  when: Trigger[];
  whenOversize?: boolean;
  minCount: number;
  maxCount?: number;
  minSquareIn: number;
  colors: string;
  source: RuleSource;
};

export type LampRule = {
  when: Trigger[];
  /** Plain description of the lamps and where they go. */
  lamps: { position: string; color: 'red' | 'amber'; count: number; visibleFt?: number }[];
  reflectors?: { position: string; color: 'red' | 'amber'; count: number }[];
  note?: string;
  source: RuleSource;
};

export type HolidayName =
  | 'new-years-day'
  | 'mlk-day'
  | 'washingtons-birthday'
  | 'memorial-day'
  | 'juneteenth'
  | 'independence-day'
  | 'labor-day'
  | 'columbus-day'
  | 'veterans-day'
  | 'thanksgiving'
  | 'day-after-thanksgiving'
  | 'christmas-eve'
  | 'christmas';

export type Curfew = {
  /** Local wall-clock `HH:MM`, end exclusive. */
  start: string;
  end: string;
  /** 0 = Sunday … 6 = Saturday; all days when absent. */
  days?: number[];
  appliesIn: 'urban' | 'everywhere';
  /** Exempt configurations (e.g. overweight only, or overlength only up to `maxLengthIn`). */
  exempt?: { overweightOnly?: boolean; overlengthOnlyMaxIn?: number };
  source: RuleSource;
};

export type TravelRules = {
  /** Travel only in daylight: from sunrise + `startOffsetMin` to sunset + `endOffsetMin` (negative = before). */
  daylight: { startOffsetMin: number; endOffsetMin: number; source: RuleSource } | null;
  weekends: { allowed: boolean; source: RuleSource };
  holidays: {
    names: HolidayName[];
    /**
     * When the restriction starts: `noon-weekday-before` (noon of the preceding weekday, Friday for a Monday
     * holiday), `noon-day-before`, or `day-only` (the holiday itself).
     */
    from: 'noon-weekday-before' | 'noon-day-before' | 'day-only';
    /** Which date of a weekend holiday is restricted: the calendar date, the federal observed date, or both. */
    observance: 'actual' | 'observed' | 'both';
    source: RuleSource;
  };
  curfews: Curfew[];
  /** No movement when visibility is reduced below this distance. */
  minVisibilityFt?: { value: number; source: RuleSource };
};

export type WidthTier = { upToIn?: number; feeUsd: number };
export type DimensionTier = { maxWidthIn?: number; maxHeightIn?: number; maxLengthIn?: number; feeUsd: number };
export type WeightBracket = { overLb: number; upToLb?: number; feeUsd: number };

/** Fee formula. Amounts in US dollars. */
export type FeeRule = {
  baseUsd: number;
  /** Replaces nothing: added to the base. First tier whose `upToIn` covers the width (last without `upToIn`). */
  widthTiers?: WidthTier[];
  /** For oversize moves: the first tier whose maxima all hold, else the last tier. */
  dimensionTiers?: DimensionTier[];
  /** For overweight moves: the bracket that contains the gross. */
  weightBrackets?: WeightBracket[];
  /** Per ton (2,000 lb) per mile above a threshold: a fixed weight, or the registered gross. */
  tonMile?: { usdPerTonMile: number; overLb?: number; overRegisteredGross?: boolean; appliesAboveLb?: number };
  addOns?: { label: string; feeUsd: number; when?: 'always' | 'oversize' | 'overweight' }[];
  refundable?: boolean;
  source: RuleSource;
};

export type SuperloadThresholds = {
  widthOverIn?: number;
  heightOverIn?: number;
  lengthOverIn?: number;
  grossOverLb?: number;
  source: RuleSource;
};

export type JurisdictionRule = {
  /** Postal code or `US` for the federal default. */
  code: string;
  name: string;
  /** True when any part of the record is sample data. */
  sample: boolean;
  asOf: string;
  legal: LegalLimits;
  permit: { validityDays: number; leadTimeDays: number; source: RuleSource };
  escorts: EscortRules;
  signs: SignRule[];
  flags: FlagRule[];
  lamps: LampRule[];
  travel: TravelRules;
  fee: FeeRule;
  superload: SuperloadThresholds;
};

/** The measured facts a rule is compared with. */
export type MeasuredLoad = {
  widthIn: number;
  heightIn: number;
  lengthIn: number;
  frontOverhangIn: number;
  rearOverhangIn: number;
  sideProjectionIn: number;
  grossLb: number;
};

/** True when the trigger fires for this load. */
export function triggerFires(t: Trigger, m: MeasuredLoad): boolean {
  const v = measureValue(t.measure, m);
  if (t.over !== undefined && v > t.over) return true;
  if (t.atLeast !== undefined && v >= t.atLeast) return true;
  return false;
}

export function measureValue(measure: Measure, m: MeasuredLoad): number {
  switch (measure) {
    case 'width':
      return m.widthIn;
    case 'height':
      return m.heightIn;
    case 'length':
      return m.lengthIn;
    case 'frontOverhang':
      return m.frontOverhangIn;
    case 'rearOverhang':
      return m.rearOverhangIn;
    case 'sideProjection':
      return m.sideProjectionIn;
    case 'gross':
      return m.grossLb;
    default:
      throw new RangeError(`unknown measure ${String(measure)}`);
  }
}

/** Threshold of a trigger and its comparison, for explanations. */
export function describeTrigger(t: Trigger): { threshold: number; words: string } {
  return t.over !== undefined ? { threshold: t.over, words: 'over' } : { threshold: t.atLeast ?? 0, words: 'at least' };
}

/** A dimension over the jurisdiction's legal limit. */
export type OverLegal = { measure: Measure; value: number; limit: number; overBy: number; source: RuleSource };

/** Dimensions of the load over the legal limits (width, height, length, overhangs). */
export function dimensionsOverLegal(legal: LegalLimits, m: MeasuredLoad): OverLegal[] {
  const out: OverLegal[] = [];
  const src = legal.dimensionSources;
  const check = (measure: Measure, value: number, limit: number | null, source: RuleSource): void => {
    if (limit !== null && value > limit + 1e-9) out.push({ measure, value, limit, overBy: value - limit, source });
  };
  check('width', m.widthIn, legal.widthIn, src.width);
  check('height', m.heightIn, legal.heightIn, src.height);
  check('length', m.lengthIn, legal.lengthIn, src.length);
  check('frontOverhang', m.frontOverhangIn, legal.frontOverhangIn, src.overhangs);
  check('rearOverhang', m.rearOverhangIn, legal.rearOverhangIn, src.overhangs);
  return out;
}

export const MEASURE_LABELS: Record<Measure, string> = {
  width: 'width',
  height: 'height',
  length: 'length',
  frontOverhang: 'front overhang',
  rearOverhang: 'rear overhang',
  sideProjection: 'side projection',
  gross: 'gross weight',
};

/** Cites a rule source in one string, marking sample data. */
export function cite(s: RuleSource): string {
  return `${s.citation} (as of ${s.asOf}${s.sample ? ', sample data' : ''})`;
}
