/** Axle-group loads by static equilibrium, the combination's axle list, and the sliding-axle suggestion. */
import { AxleInput, AxleLimits, checkAxleWeights } from './axle-weights';
import { PLANNING_CAUTION, Reason, SOURCES } from './reasons';
import { formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

export type TractorAxleGeometry = {
  steerTareLb: number;
  driveTareLb: number;
  /** Steer axle to the drive-group center. */
  wheelbaseFt: number;
  /** Kingpin (fifth wheel) ahead of the drive-group center; negative when behind it. */
  fifthWheelAheadOfDriveFt: number;
};

export type TrailerAxleGeometry = {
  tareLb: number;
  /** Trailer tare center of gravity behind the kingpin. */
  tareCgFromKingpinFt: number;
  /** Trailer axle-group center behind the kingpin (the slider setting on a sliding axle). */
  axleGroupFromKingpinFt: number;
};

/** One article on the deck: its weight and center of gravity behind the kingpin (negative = ahead of it). */
export type LoadOnDeck = { weightLb: number; cgFromKingpinFt: number };

export type AxleGroupLoadsInput = {
  tractor: TractorAxleGeometry;
  trailer: TrailerAxleGeometry;
  loads: LoadOnDeck[];
};

export type AxleGroupLoadsResult = {
  steerLb: number;
  driveLb: number;
  trailerLb: number;
  kingpinLb: number;
  grossLb: number;
  warnings: string[];
  reasons: Reason[];
  caution: string;
};

function validateInput(input: AxleGroupLoadsInput): void {
  const { tractor, trailer, loads } = input;
  checkNumber('tractor.steerTareLb', tractor.steerTareLb, { min: 0, max: ABSURD.axleWeightLb, unit: 'lb' });
  checkNumber('tractor.driveTareLb', tractor.driveTareLb, { min: 0, max: ABSURD.axleWeightLb, unit: 'lb' });
  checkNumber('tractor.wheelbaseFt', tractor.wheelbaseFt, { min: 0, minExclusive: true, max: 60, unit: 'ft' });
  checkNumber('tractor.fifthWheelAheadOfDriveFt', tractor.fifthWheelAheadOfDriveFt, {
    min: -10,
    max: tractor.wheelbaseFt,
    unit: 'ft',
  });
  checkNumber('trailer.tareLb', trailer.tareLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
  checkNumber('trailer.tareCgFromKingpinFt', trailer.tareCgFromKingpinFt, { min: -50, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber('trailer.axleGroupFromKingpinFt', trailer.axleGroupFromKingpinFt, {
    min: 0,
    minExclusive: true,
    max: ABSURD.lengthFt,
    unit: 'ft',
  });
  if (!Array.isArray(loads)) throw new RangeError('loads must be an array');
  loads.forEach((l, i) => {
    checkNumber(`loads[${i}].weightLb`, l.weightLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
    checkNumber(`loads[${i}].cgFromKingpinFt`, l.cgFromKingpinFt, { min: -100, max: ABSURD.lengthFt, unit: 'ft' });
  });
}

function solve(input: AxleGroupLoadsInput): { steerLb: number; driveLb: number; trailerLb: number; kingpinLb: number } {
  const { tractor, trailer, loads } = input;
  let weight = trailer.tareLb;
  let moment = trailer.tareLb * trailer.tareCgFromKingpinFt;
  for (const l of loads) {
    weight += l.weightLb;
    moment += l.weightLb * l.cgFromKingpinFt;
  }
  // Moments about the kingpin: the trailer group carries moment / lever; the kingpin carries the rest.
  const trailerLb = moment / trailer.axleGroupFromKingpinFt;
  const kingpinLb = weight - trailerLb;
  // The kingpin load splits between steer and drive by the fifth wheel's lever over the wheelbase.
  const steerShare = tractor.fifthWheelAheadOfDriveFt / tractor.wheelbaseFt;
  const steerLb = tractor.steerTareLb + kingpinLb * steerShare;
  const driveLb = tractor.driveTareLb + kingpinLb * (1 - steerShare);
  return { steerLb, driveLb, trailerLb, kingpinLb };
}

/** Steer, drive and trailer group loads, the kingpin load and the gross, by static equilibrium. */
export function axleGroupLoads(input: AxleGroupLoadsInput): AxleGroupLoadsResult {
  validateInput(input);
  const { steerLb, driveLb, trailerLb, kingpinLb } = solve(input);
  const grossLb =
    input.tractor.steerTareLb +
    input.tractor.driveTareLb +
    input.trailer.tareLb +
    input.loads.reduce((s, l) => s + l.weightLb, 0);
  const warnings: string[] = [];
  if (kingpinLb < 0) warnings.push('the kingpin load is negative: the load sits too far rearward and would lift the trailer off the fifth wheel');
  if (trailerLb < 0) warnings.push('the trailer group load is negative: the load sits too far forward of the kingpin');
  if (steerLb < 0) warnings.push('the steer axle load is negative: the fifth wheel is set too far forward');
  const reasons: Reason[] = [
    {
      code: 'statics',
      message: `moments about the kingpin put ${formatPounds(Math.max(0, trailerLb))} on the trailer group and ${formatPounds(
        Math.max(0, kingpinLb),
      )} on the kingpin, split ${formatPounds(Math.max(0, steerLb))} steer / ${formatPounds(Math.max(0, driveLb))} drive`,
      value: grossLb,
      unit: 'lb',
      source: SOURCES.statics,
    },
  ];
  return { steerLb, driveLb, trailerLb, kingpinLb, grossLb, warnings, reasons, caution: PLANNING_CAUTION };
}

/** Where each axle sits within its group: offsets of each axle from the group center, front to rear. */
export type AxleLayout = {
  driveAxleOffsetsFt: number[];
  trailerAxleOffsetsFt: number[];
};

/**
 * The combination's axles, front to rear, with positions from the steer axle, each group's load shared
 * equally by its axles (equalised suspension). Feeds `checkAxleWeights`.
 */
export function combinationAxles(
  loads: { steerLb: number; driveLb: number; trailerLb: number },
  tractor: TractorAxleGeometry,
  trailer: Pick<TrailerAxleGeometry, 'axleGroupFromKingpinFt'>,
  layout: AxleLayout,
): AxleInput[] {
  if (layout.driveAxleOffsetsFt.length === 0) throw new RangeError('layout.driveAxleOffsetsFt must list at least one axle');
  if (layout.trailerAxleOffsetsFt.length === 0) throw new RangeError('layout.trailerAxleOffsetsFt must list at least one axle');
  const kingpinFt = tractor.wheelbaseFt - tractor.fifthWheelAheadOfDriveFt;
  const trailerCenter = kingpinFt + trailer.axleGroupFromKingpinFt;
  const axles: AxleInput[] = [{ positionFt: 0, weightLb: Math.max(0, loads.steerLb) }];
  const nd = layout.driveAxleOffsetsFt.length;
  for (const o of layout.driveAxleOffsetsFt) axles.push({ positionFt: tractor.wheelbaseFt + o, weightLb: Math.max(0, loads.driveLb) / nd });
  const nt = layout.trailerAxleOffsetsFt.length;
  for (const o of layout.trailerAxleOffsetsFt) axles.push({ positionFt: trailerCenter + o, weightLb: Math.max(0, loads.trailerLb) / nt });
  return axles;
}

export type SliderRange = {
  minFromKingpinFt: number;
  maxFromKingpinFt: number;
  /** Spacing of the slider's locking holes. */
  holeSpacingIn: number;
};

export type GroupLimits = { steerLb: number; driveLb: number; trailerLb: number };

export type SliderSuggestionInput = AxleGroupLoadsInput & {
  slider: SliderRange;
  /** With a layout, every setting is checked axle by axle (bridge formula included). */
  layout?: AxleLayout;
  /** Per-group limits (default 20,000 steer, 34,000 drive tandem, 34,000 trailer tandem). */
  groupLimits?: Partial<GroupLimits>;
  axleLimits?: Partial<AxleLimits>;
};

export type SliderCandidate = {
  axleGroupFromKingpinFt: number;
  steerLb: number;
  driveLb: number;
  trailerLb: number;
  ok: boolean;
  /** Highest load-to-limit ratio over the groups (lower = more balanced). */
  utilisation: number;
  violations: string[];
};

export type SliderSuggestion = {
  found: boolean;
  best: SliderCandidate | null;
  candidates: SliderCandidate[];
  message: string;
  reasons: Reason[];
  caution: string;
};

/**
 * Searches the slider's range, hole by hole, for settings that keep every group legal; prefers the most
 * balanced one (lowest highest load-to-limit ratio). Says so when none exists.
 */
export function suggestSliderPosition(input: SliderSuggestionInput): SliderSuggestion {
  validateInput(input);
  const { slider } = input;
  checkNumber('slider.minFromKingpinFt', slider.minFromKingpinFt, { min: 0, minExclusive: true, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber('slider.maxFromKingpinFt', slider.maxFromKingpinFt, { min: slider.minFromKingpinFt, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber('slider.holeSpacingIn', slider.holeSpacingIn, { min: 0, minExclusive: true, max: 120, unit: 'in' });
  const steps = Math.floor(((slider.maxFromKingpinFt - slider.minFromKingpinFt) * 12) / slider.holeSpacingIn + 1e-9);
  if (steps > 1000) throw new RangeError(`slider: at most 1000 hole positions (absurd value); got ${steps + 1}`);
  const gl: GroupLimits = { steerLb: 20_000, driveLb: 34_000, trailerLb: 34_000, ...input.groupLimits };
  const candidates: SliderCandidate[] = [];
  for (let s = 0; s <= steps; s++) {
    const at = slider.minFromKingpinFt + (s * slider.holeSpacingIn) / 12;
    const trailer = { ...input.trailer, axleGroupFromKingpinFt: at };
    const r = solve({ ...input, trailer });
    const violations: string[] = [];
    let utilisation = Math.max(r.steerLb / gl.steerLb, r.driveLb / gl.driveLb, r.trailerLb / gl.trailerLb);
    if (r.steerLb > gl.steerLb) violations.push(`steer ${formatPounds(r.steerLb)} over ${formatPounds(gl.steerLb)}`);
    if (r.kingpinLb < 0) violations.push('negative kingpin load');
    if (input.layout) {
      const check = checkAxleWeights(combinationAxles(r, input.tractor, trailer, input.layout), input.axleLimits);
      for (const g of check.groups) utilisation = Math.max(utilisation, g.limitLb > 0 ? g.weightLb / g.limitLb : Infinity);
      for (const v of check.violations) violations.push(v.message);
    } else {
      if (r.driveLb > gl.driveLb) violations.push(`drive group ${formatPounds(r.driveLb)} over ${formatPounds(gl.driveLb)}`);
      if (r.trailerLb > gl.trailerLb) violations.push(`trailer group ${formatPounds(r.trailerLb)} over ${formatPounds(gl.trailerLb)}`);
    }
    candidates.push({
      axleGroupFromKingpinFt: Math.round(at * 1000) / 1000,
      steerLb: r.steerLb,
      driveLb: r.driveLb,
      trailerLb: r.trailerLb,
      ok: violations.length === 0,
      utilisation,
      violations,
    });
  }
  let best: SliderCandidate | null = null;
  for (const c of candidates) if (c.ok && (!best || c.utilisation < best.utilisation - 1e-12)) best = c;
  const message = best
    ? `set the trailer axle group ${best.axleGroupFromKingpinFt} ft behind the kingpin: every group legal, highest group at ${Math.round(
        best.utilisation * 100,
      )} % of its limit`
    : 'no slider setting keeps every group within its limit: move the load, change equipment or permit the weight';
  return {
    found: best !== null,
    best,
    candidates,
    message,
    reasons: [{ code: 'slider-search', message, source: `${SOURCES.statics}; ${SOURCES.usc127}` }],
    caution: PLANNING_CAUTION,
  };
}
