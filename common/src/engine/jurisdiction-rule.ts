/**
 * A rulebook record: what one jurisdiction regulates for oversize/overweight moves. Every value is a `Fact`: it
 * carries its own status and source — `sourced` (read in the state's statute, administrative code or its DOT or
 * state-patrol permit documents), `secondary` (read in an official secondary source such as a federal or
 * university summary) or `unknown` (not on file: no value, and a note of what was searched).
 *
 * A value that is `null` in a known fact means the text sets no such limit ("no overall length limit"), which is
 * different from not on file. JSON-serialisable (stored as jsonb by the server). Lengths in inches, weights in
 * pounds, times in minutes, money in US dollars.
 */

/** How a value is known. */
export type FactStatus = 'sourced' | 'secondary' | 'unknown';

/** Where a known value comes from. */
export type RuleSource = {
  /** Statute or code section, or document title and section, e.g. "24VAC20-81-180(B)". */
  citation: string;
  /** The URL as found. */
  url: string;
  /** Edition or effective date of the text, as it names itself (e.g. "effective 2023-07-01", "rev. 2022"). */
  edition: string;
  /** Date the value was read, `YYYY-MM-DD`. */
  asOf: string;
  /** The words of the text the value was read from (short). */
  quote?: string;
  note?: string;
};

export type KnownFact<T> = { status: 'sourced' | 'secondary'; value: T } & RuleSource;
export type UnknownFact = { status: 'unknown'; note: string };
/** One rule value with its own status and source. */
export type Fact<T> = KnownFact<T> | UnknownFact;

/** True for a record of the current schema (every value a fact); older versions kept in history are not. */
export const isFactRecord = (r: unknown): r is JurisdictionRule => !!r && typeof r === 'object' && (r as { schema?: unknown }).schema === 2;

export const isKnown = <T>(f: Fact<T> | undefined | null): f is KnownFact<T> => !!f && f.status !== 'unknown';
/** The value of a known fact, else undefined. */
export const valueOf = <T>(f: Fact<T> | undefined | null): T | undefined => (isKnown(f) ? f.value : undefined);

/** Road classes an escort rule can name. `multilane` = divided / four or more lanes (not interstate). */
export type RoadType = 'two-lane' | 'multilane' | 'interstate';
export const ROAD_TYPES: readonly RoadType[] = ['two-lane', 'multilane', 'interstate'];

/** Measures a trigger can look at. Lengths in inches, weights in pounds. */
export type Measure =
  | 'width'
  | 'height'
  | 'length'
  | 'frontOverhang'
  | 'rearOverhang'
  | 'sideProjection'
  | 'gross';
export const MEASURES: readonly Measure[] = ['width', 'height', 'length', 'frontOverhang', 'rearOverhang', 'sideProjection', 'gross'];

/** `over` is a strict threshold (value > over); `atLeast` an inclusive one (value ≥ atLeast). Give one. */
export type Trigger = { measure: Measure; over?: number; atLeast?: number };

export type BridgeRule = {
  /** The federal bridge formula (23 U.S.C. 127) or a state table of the same shape. */
  formula: boolean;
  /** Two-tandem exception distance (36 ft federally); null = none. */
  tandemPairMinFt: number | null;
  /** How the table rounds a tie between two rows. */
  tie: 'down' | 'up';
};

export type LegalLimits = {
  widthIn: Fact<number>;
  heightIn: Fact<number>;
  /** Overall length of a tractor-semitrailer; null = the text sets none for this combination. */
  overallLengthIn: Fact<number | null>;
  semitrailerLengthIn: Fact<number | null>;
  /** Load projection beyond the front bumper / rear of the vehicle; null = none set. */
  frontOverhangIn: Fact<number | null>;
  rearOverhangIn: Fact<number | null>;
  singleAxleLb: Fact<number>;
  tandemLb: Fact<number>;
  tridemLb: Fact<number | null>;
  grossLb: Fact<number>;
  bridge: Fact<BridgeRule>;
  /** Weight per inch of tire width, where the state uses it. */
  tireLbPerInch: Fact<number | null>;
};

/** Routine (non-superload) permit maxima. Any may be absent. */
export type PermitMaxima = {
  widthIn?: number;
  heightIn?: number;
  lengthIn?: number;
  singleAxleLb?: number;
  tandemLb?: number;
  tridemLb?: number;
  quadLb?: number;
  grossLb?: number;
  tireLbPerInch?: number;
  note?: string;
};

export type PermitRules = {
  /** Single-trip permit validity. */
  validityDays: Fact<number>;
  /** How far ahead to apply. */
  leadTimeDays: Fact<number>;
  /** Permit classes the state issues, in its own words (e.g. "single trip", "annual"). */
  classes: Fact<string[]>;
  routineMaxima: Fact<PermitMaxima>;
};

export type SuperloadThresholds = { widthOverIn?: number; heightOverIn?: number; lengthOverIn?: number; grossOverLb?: number };

export type EscortRule = {
  /** The measure and threshold that asks for escorts. */
  when: Trigger;
  roads: RoadType[];
  front: number;
  rear: number;
  heightPole?: boolean;
  /** Accepted alternatives in the text's words (e.g. "an amber flashing light instead of the rear escort"). */
  alternative?: string;
  /** Law-enforcement escort instead of (or besides) civilian escorts. */
  police?: boolean;
};

/** Escort rules by the measure that asks for them; each measure is its own fact. */
export type EscortRules = {
  width: Fact<EscortRule[]>;
  height: Fact<EscortRule[]>;
  length: Fact<EscortRule[]>;
  frontOverhang: Fact<EscortRule[]>;
  rearOverhang: Fact<EscortRule[]>;
  /** Off-center / side projection. */
  sideProjection: Fact<EscortRule[]>;
  /** A load over escort limits in two measures needs front and rear escorts unless the pair is excepted; null = no such rule. */
  twoDimensionRule: Fact<{ exceptPairs: [Measure, Measure][] } | null>;
  /** The height pole is set this far above the load's height. */
  heightPoleMarginIn: Fact<number>;
  /** Certification the escort operator needs, in the text's words; null = none asked. */
  certification: Fact<string | null>;
};

/** The escort measures an `EscortRules` holds, in order. */
export const ESCORT_MEASURES = ['width', 'height', 'length', 'frontOverhang', 'rearOverhang', 'sideProjection'] as const;
export type EscortMeasure = (typeof ESCORT_MEASURES)[number];

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
};

export type FlagRule = {
  kind: 'corners' | 'width-extremities' | 'overhang';
  when: Trigger[];
  whenOversize?: boolean;
  minCount: number;
  maxCount?: number;
  /** Side of the square flag in inches: "18 inches square" = 18 (not the area). */
  minSquareIn: number;
  colors: string;
};

export type LampRule = {
  when: Trigger[];
  lamps: { position: string; color: 'red' | 'amber'; count: number; visibleFt?: number }[];
  reflectors?: { position: string; color: 'red' | 'amber'; count: number }[];
  note?: string;
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

/** Dimensions a travel rule applies above (any one over); absent = every permitted load. */
export type AppliesAbove = { widthOverIn?: number; heightOverIn?: number; lengthOverIn?: number; grossOverLb?: number };

export type DaylightRule = {
  /** From sunrise + `startOffsetMin` to sunset + `endOffsetMin` (negative = before). */
  startOffsetMin: number;
  endOffsetMin: number;
  /** The rule applies only to loads over these (e.g. night travel allowed up to 10 ft wide). */
  appliesAbove?: AppliesAbove;
};

export type WeekendBan = {
  /** 0 = Sunday … 6 = Saturday. */
  day: number;
  /** Local `HH:MM`; whole day when absent. */
  from?: string;
  to?: string;
};
export type WeekendRule = { bans: WeekendBan[]; appliesAbove?: AppliesAbove };

export type HolidayRule = {
  names: HolidayName[];
  /**
   * When the restriction starts: `noon-weekday-before` (noon of the preceding weekday, Friday for a Monday
   * holiday), `noon-day-before`, or `day-only` (the holiday itself).
   */
  from: 'noon-weekday-before' | 'noon-day-before' | 'day-only';
  /** Which date of a weekend holiday is restricted: the calendar date, the observed date, or both. */
  observance: 'actual' | 'observed' | 'both';
  /** When the restriction ends on the holiday, local `HH:MM` (absent = midnight at its end). */
  until?: string;
  appliesAbove?: AppliesAbove;
};

export type Curfew = {
  /** The named area (city, county, metro) the curfew covers, in the text's words. */
  area: string;
  /** Local wall-clock `HH:MM`; an end before the start crosses midnight. */
  start: string;
  end: string;
  /** 0 = Sunday … 6 = Saturday (the day the curfew starts); all days when absent. */
  days?: number[];
  /** `urban` = on segments marked urban; `everywhere` = the whole jurisdiction. */
  appliesIn: 'urban' | 'everywhere';
  exempt?: { overweightOnly?: boolean; overlengthOnlyMaxIn?: number };
  appliesAbove?: AppliesAbove;
};

export type TravelRules = {
  /** Daylight-only travel; null = the text allows travel at any hour. */
  daylight: Fact<DaylightRule | null>;
  /** Weekend limits; an empty list = weekends allowed. */
  weekends: Fact<WeekendRule>;
  /** Holiday limits; an empty list of names = no holiday limit. */
  holidays: Fact<HolidayRule>;
  curfews: Fact<Curfew[]>;
  /** No movement when visibility is reduced below this distance (ft). */
  minVisibilityFt: Fact<number | null>;
};

export type WidthTier = { upToIn?: number; feeUsd: number };
export type DimensionTier = { maxWidthIn?: number; maxHeightIn?: number; maxLengthIn?: number; feeUsd: number };
export type WeightBracket = { overLb: number; upToLb?: number; feeUsd: number };

/** Fee formula. Amounts in US dollars. */
export type FeeRule = {
  baseUsd: number;
  /** Added to the base. First tier whose `upToIn` covers the width (last without `upToIn`). */
  widthTiers?: WidthTier[];
  /** For oversize moves: the first tier whose maxima all hold, else the last tier. */
  dimensionTiers?: DimensionTier[];
  /** For overweight moves: the bracket that contains the gross. */
  weightBrackets?: WeightBracket[];
  /** Per ton (2,000 lb) per mile above a threshold: a fixed weight, or the registered gross. */
  tonMile?: { usdPerTonMile: number; overLb?: number; overRegisteredGross?: boolean; appliesAboveLb?: number };
  /** Per mile travelled in the state. */
  perMile?: { usdPerMile: number; when?: 'always' | 'oversize' | 'overweight' };
  /**
   * A load both oversize and overweight: `sum` adds the dimension and weight parts; `weight-only` charges the base
   * plus the weight part alone (the dimension part is not added).
   */
  combined?: 'sum' | 'weight-only';
  addOns?: { label: string; feeUsd: number; when?: 'always' | 'oversize' | 'overweight' }[];
  refundable?: boolean;
};

export type SpeedRule = { maxMph: number | null; note?: string };

export type JurisdictionRule = {
  /** Postal code. */
  code: string;
  name: string;
  /** Record schema version. */
  schema: 2;
  /** Date the record was last reviewed, `YYYY-MM-DD`. */
  asOf: string;
  legal: LegalLimits;
  permit: PermitRules;
  superload: Fact<SuperloadThresholds>;
  escorts: EscortRules;
  signs: Fact<SignRule[]>;
  flags: Fact<FlagRule[]>;
  lamps: Fact<LampRule[]>;
  travel: TravelRules;
  fee: Fact<FeeRule>;
  speed: Fact<SpeedRule>;
  /** What the researcher searched and did not find, for the next person. */
  researchNotes?: string;
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

/** True when the load is over any of the given dimensions (or the rule has none). */
export function appliesTo(a: AppliesAbove | undefined, m: Partial<MeasuredLoad>): boolean {
  if (!a) return true;
  return (
    (a.widthOverIn !== undefined && (m.widthIn ?? 0) > a.widthOverIn) ||
    (a.heightOverIn !== undefined && (m.heightIn ?? 0) > a.heightOverIn) ||
    (a.lengthOverIn !== undefined && (m.lengthIn ?? 0) > a.lengthOverIn) ||
    (a.grossOverLb !== undefined && (m.grossLb ?? 0) > a.grossOverLb)
  );
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

export const MEASURE_LABELS: Record<Measure, string> = {
  width: 'width',
  height: 'height',
  length: 'length',
  frontOverhang: 'front overhang',
  rearOverhang: 'rear overhang',
  sideProjection: 'side projection',
  gross: 'gross weight',
};

/** Cites a known fact in one string, marking secondary sources. */
export function cite(s: RuleSource & { status?: FactStatus }): string {
  return `${s.citation}${s.status === 'secondary' ? ' (secondary source)' : ''} (as of ${s.asOf})`;
}
