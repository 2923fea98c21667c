/**
 * Axle-group loads by static equilibrium — tractor, optional jeep, one or more trailer groups, optional booster —
 * the combination's axle list, and the sliding-axle / jeep / booster position suggestions.
 */
import { AxleInput, AxleLimits, AxleTires, FEDERAL_AXLE_LIMITS, checkAxleWeights, groupLimit } from './axle-weights';
import { PLANNING_CAUTION, Reason, SOURCES } from './reasons';
import { parseTireSize } from './tire-size';
import { formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

/** A lift axle of a group, by its index in the group (0 = front axle), and whether it is up. */
export type LiftAxle = { index: number; up: boolean };

/** One axle group as built. */
export type AxleGroupSpec = {
  /** Axles in the group, lift axles included. */
  axleCount: number;
  /** Equal spacing between consecutive axles (ft); ignored for one axle or when `offsetsFt` is given. */
  spacingFt?: number;
  /**
   * Each axle's place, front to rear (ft): from the group's nominal center for drive, jeep, trailer and booster
   * groups; from the front steer axle for the steer group (so a single steer axle is [0]).
   */
  offsetsFt?: number[];
  /** Lift axles: an axle that is up carries nothing and drops out of the group's count and spread. */
  liftAxles?: LiftAxle[];
  tires?: AxleTires;
};

export type TractorAxleGeometry = {
  steerTareLb: number;
  driveTareLb: number;
  /** Steer axle to the drive-group center. */
  wheelbaseFt: number;
  /** Kingpin (fifth wheel) ahead of the drive-group center; negative when behind it. */
  fifthWheelAheadOfDriveFt: number;
  /** The steer group's axles (default one steer axle). `steerTareLb`/`driveTareLb` are the empty tractor's scale weights. */
  steerGroup?: AxleGroupSpec;
  /** The drive group's axles, about the drive-group center. */
  driveGroup?: AxleGroupSpec;
};

/** A further trailer axle group (fixed, or sliding with its own range), its center behind the kingpin. */
export type TrailerAxleGroup = AxleGroupSpec & { centerFromKingpinFt: number };

export type TrailerAxleGeometry = {
  tareLb: number;
  /** Trailer tare center of gravity behind the kingpin. */
  tareCgFromKingpinFt: number;
  /** Trailer axle-group center behind the kingpin (the slider setting on a sliding axle). */
  axleGroupFromKingpinFt: number;
  /** The axles of that group. */
  group?: AxleGroupSpec;
  /**
   * More trailer groups (e.g. a split group). All trailer groups — and a booster set to equalize — share the
   * trailer's load equally per axle that is down (one interconnected suspension).
   */
  moreGroups?: TrailerAxleGroup[];
};

/**
 * A jeep (dolly) ahead of the trailer: its pin sits in the tractor's fifth wheel, its own fifth wheel carries the
 * trailer's kingpin. The kingpin load splits between the jeep's axles and its pin by moments about the pin.
 */
export type JeepGeometry = {
  tareLb: number;
  /** Jeep center of gravity behind its pin. */
  tareCgBehindPinFt: number;
  /** The jeep's fifth wheel (under the trailer's kingpin) behind its pin (a sliding fifth wheel's setting). */
  fifthWheelBehindPinFt: number;
  /** The jeep's axle-group center behind its pin. */
  axleGroupBehindPinFt: number;
  group?: AxleGroupSpec;
};

/**
 * A booster behind the trailer, on a pressurised gooseneck pinned to the trailer's rear. Its hydraulic setting
 * decides its share: by default it is set to equalize (each booster axle carries what each trailer axle carries);
 * or `pinLoadLb` gives the load it takes from the trailer at the pin. The gooseneck carries the moment.
 */
export type BoosterGeometry = {
  tareLb: number;
  /** The booster's pin on the trailer, behind the kingpin. */
  pinFromKingpinFt: number;
  /** Booster center of gravity behind its pin. */
  tareCgBehindPinFt: number;
  /** The booster's axle-group center behind its pin (its extension setting). */
  axleGroupBehindPinFt: number;
  group?: AxleGroupSpec;
  /** Load the hydraulic setting takes from the trailer at the pin; absent = set to equalize with the trailer's axles. */
  pinLoadLb?: number;
};

/** One article on the deck: its weight and center of gravity behind the kingpin (negative = ahead of it). */
export type LoadOnDeck = { weightLb: number; cgFromKingpinFt: number };

export type AxleGroupLoadsInput = {
  tractor: TractorAxleGeometry;
  trailer: TrailerAxleGeometry;
  loads: LoadOnDeck[];
  jeep?: JeepGeometry;
  booster?: BoosterGeometry;
  /**
   * Warn when the steer load falls below this share of its unloaded value (e.g. 0.8). A rule of thumb for steering
   * control: common practice, no published source.
   */
  steerMinShareOfUnloaded?: number;
};

/** One axle's load. Positions are feet behind the (front) steer axle. */
export type AxleLoad = { positionFt: number; weightLb: number; lifted: boolean };

export type GroupLoad = {
  /** `steer`, `drive`, `jeep`, `trailer`, `trailer-2`…, `booster`. */
  key: string;
  unit: 'tractor' | 'jeep' | 'trailer' | 'booster';
  label: string;
  loadLb: number;
  /** Center of the axles that are down, ft behind the steer axle. */
  centerFt: number;
  /** Axles down; null when the group's axles are not described. */
  axleCount: number | null;
  liftedCount: number;
  /** Spread of the axles that are down; null when not described. */
  spreadFt: number | null;
  /** Each axle's load (equal share within the group, none on a lift axle that is up); empty when not described. */
  axles: AxleLoad[];
  tires?: AxleTires;
};

export type SteerShareCheck = {
  unloadedLb: number;
  loadedLb: number;
  share: number;
  minShare: number;
  ok: boolean;
  source: string;
};

export type AxleGroupLoadsResult = {
  steerLb: number;
  driveLb: number;
  /** All trailer groups together (the booster apart). */
  trailerLb: number;
  /** The trailer's kingpin load (on the jeep's fifth wheel when a jeep is used). */
  kingpinLb: number;
  grossLb: number;
  warnings: string[];
  reasons: Reason[];
  caution: string;
  /** Every group, front to rear. */
  groups: GroupLoad[];
  /** Load on the tractor's fifth wheel: the kingpin's, or the jeep pin's with a jeep. */
  fifthWheelLb: number;
  jeepPinLb: number | null;
  jeepLb: number | null;
  boosterLb: number | null;
  /** Vertical load the booster takes from the trailer at its pin. */
  boosterPinLb: number | null;
  /** Moment its gooseneck carries at the pin (lb·ft, positive = lifting the trailer's rear). */
  boosterPinMomentLbFt: number | null;
  /** The groups' loads against the total weight (tractor + trailer + jeep + booster + load). */
  balance: { totalWeightLb: number; sumOfGroupsLb: number; differenceLb: number; ok: boolean };
  steerShare: SteerShareCheck | null;
};

type Placed = { spec: AxleGroupSpec | undefined; nominalFt: number; positions: number[]; downPositions: number[]; center: number };

function checkSpec(field: string, g: AxleGroupSpec | undefined): void {
  if (g === undefined) return;
  if (!g || typeof g !== 'object') throw new RangeError(`${field} must describe the group's axles`);
  checkNumber(`${field}.axleCount`, g.axleCount, { min: 1, max: 12, integer: true });
  if (g.offsetsFt !== undefined) {
    if (!Array.isArray(g.offsetsFt) || g.offsetsFt.length !== g.axleCount) throw new RangeError(`${field}.offsetsFt must list one offset per axle (${g.axleCount})`);
    g.offsetsFt.forEach((o, i) => {
      checkNumber(`${field}.offsetsFt[${i}]`, o, { min: -60, max: 60, unit: 'ft' });
      if (i > 0 && o < g.offsetsFt![i - 1]) throw new RangeError(`${field}.offsetsFt must run front to rear`);
    });
  } else if (g.axleCount > 1) {
    checkNumber(`${field}.spacingFt`, g.spacingFt, { min: 0, minExclusive: true, max: 30, unit: 'ft' });
  }
  if (g.liftAxles !== undefined) {
    if (!Array.isArray(g.liftAxles)) throw new RangeError(`${field}.liftAxles must be a list`);
    g.liftAxles.forEach((l, i) => {
      checkNumber(`${field}.liftAxles[${i}].index`, l.index, { min: 0, max: g.axleCount - 1, integer: true });
      if (typeof l.up !== 'boolean') throw new RangeError(`${field}.liftAxles[${i}].up must be true or false`);
    });
    if (g.liftAxles.filter((l) => l.up).length >= g.axleCount) throw new RangeError(`${field}: at least one axle must be down`);
  }
  if (g.tires !== undefined) {
    parseTireSize(g.tires.size);
    checkNumber(`${field}.tires.count`, g.tires.count, { min: 1, max: 16, integer: true });
    if (g.tires.ratingLb !== undefined) checkNumber(`${field}.tires.ratingLb`, g.tires.ratingLb, { min: 0, minExclusive: true, max: 50_000, unit: 'lb' });
  }
}

/** Axle positions of a group (absolute, ft behind the steer axle) and the center of those that are down. */
function place(spec: AxleGroupSpec | undefined, nominalFt: number, fromFront = false): Placed {
  if (!spec) return { spec, nominalFt, positions: [nominalFt], downPositions: [nominalFt], center: nominalFt };
  const n = spec.axleCount;
  const offsets =
    spec.offsetsFt ??
    Array.from({ length: n }, (_, i) => (fromFront ? i * (spec.spacingFt ?? 0) : (i - (n - 1) / 2) * (spec.spacingFt ?? 0)));
  const positions = offsets.map((o) => nominalFt + o);
  const up = new Set((spec.liftAxles ?? []).filter((l) => l.up).map((l) => l.index));
  const downPositions = positions.filter((_, i) => !up.has(i));
  const center = downPositions.reduce((s, x) => s + x, 0) / downPositions.length;
  return { spec, nominalFt, positions, downPositions, center };
}

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
  checkSpec('tractor.steerGroup', tractor.steerGroup);
  checkSpec('tractor.driveGroup', tractor.driveGroup);
  checkNumber('trailer.tareLb', trailer.tareLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
  checkNumber('trailer.tareCgFromKingpinFt', trailer.tareCgFromKingpinFt, { min: -50, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber('trailer.axleGroupFromKingpinFt', trailer.axleGroupFromKingpinFt, {
    min: 0,
    minExclusive: true,
    max: ABSURD.lengthFt,
    unit: 'ft',
  });
  checkSpec('trailer.group', trailer.group);
  if (trailer.moreGroups !== undefined) {
    if (!Array.isArray(trailer.moreGroups) || trailer.moreGroups.length > 6) throw new RangeError('trailer.moreGroups must be a list of at most 6 groups');
    trailer.moreGroups.forEach((g, i) => {
      checkNumber(`trailer.moreGroups[${i}].centerFromKingpinFt`, g.centerFromKingpinFt, { min: 0, minExclusive: true, max: ABSURD.lengthFt, unit: 'ft' });
      checkSpec(`trailer.moreGroups[${i}]`, g);
    });
  }
  if (input.jeep !== undefined) {
    const j = input.jeep;
    checkNumber('jeep.tareLb', j.tareLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
    checkNumber('jeep.tareCgBehindPinFt', j.tareCgBehindPinFt, { min: -20, max: 100, unit: 'ft' });
    checkNumber('jeep.fifthWheelBehindPinFt', j.fifthWheelBehindPinFt, { min: 0, max: 100, unit: 'ft' });
    checkNumber('jeep.axleGroupBehindPinFt', j.axleGroupBehindPinFt, { min: 0, minExclusive: true, max: 100, unit: 'ft' });
    checkSpec('jeep.group', j.group);
  }
  if (input.booster !== undefined) {
    const b = input.booster;
    checkNumber('booster.tareLb', b.tareLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
    checkNumber('booster.pinFromKingpinFt', b.pinFromKingpinFt, { min: 0, minExclusive: true, max: ABSURD.lengthFt, unit: 'ft' });
    checkNumber('booster.tareCgBehindPinFt', b.tareCgBehindPinFt, { min: -20, max: 100, unit: 'ft' });
    checkNumber('booster.axleGroupBehindPinFt', b.axleGroupBehindPinFt, { min: 0, minExclusive: true, max: 100, unit: 'ft' });
    checkSpec('booster.group', b.group);
    if (b.pinLoadLb !== undefined) checkNumber('booster.pinLoadLb', b.pinLoadLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
  }
  if (input.steerMinShareOfUnloaded !== undefined) checkNumber('steerMinShareOfUnloaded', input.steerMinShareOfUnloaded, { min: 0, max: 1 });
  if (!Array.isArray(loads)) throw new RangeError('loads must be an array');
  loads.forEach((l, i) => {
    checkNumber(`loads[${i}].weightLb`, l.weightLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
    checkNumber(`loads[${i}].cgFromKingpinFt`, l.cgFromKingpinFt, { min: -100, max: ABSURD.lengthFt, unit: 'ft' });
  });
}

type Solved = Pick<
  AxleGroupLoadsResult,
  'steerLb' | 'driveLb' | 'trailerLb' | 'kingpinLb' | 'fifthWheelLb' | 'jeepPinLb' | 'jeepLb' | 'boosterLb' | 'boosterPinLb' | 'boosterPinMomentLbFt' | 'groups'
> & { totalWeightLb: number };

const share = (p: Placed, loadLb: number): AxleLoad[] => {
  if (!p.spec) return [];
  const up = new Set((p.spec.liftAxles ?? []).filter((l) => l.up).map((l) => l.index));
  const each = loadLb / p.downPositions.length;
  return p.positions.map((positionFt, i) => ({ positionFt, weightLb: up.has(i) ? 0 : each, lifted: up.has(i) }));
};

function groupLoad(key: string, unit: GroupLoad['unit'], label: string, p: Placed, loadLb: number): GroupLoad {
  const described = p.spec !== undefined;
  return {
    key,
    unit,
    label,
    loadLb,
    centerFt: p.center,
    axleCount: described ? p.downPositions.length : null,
    liftedCount: described ? p.positions.length - p.downPositions.length : 0,
    spreadFt: described ? p.downPositions[p.downPositions.length - 1] - p.downPositions[0] : null,
    axles: share(p, loadLb),
    ...(p.spec?.tires ? { tires: p.spec.tires } : {}),
  };
}

/**
 * Equilibrium, hinge by hinge, from the rear. Positions are feet behind the steer axle.
 * 1. Trailer (with a booster, trailer and booster together, the gooseneck carrying the moment): moments about the
 *    kingpin give the load on the trailer's axles (shared per axle down with an equalizing booster), the rest is
 *    the kingpin's. A booster with a set pin load carries that plus its own weight.
 * 2. Jeep: the kingpin load and the jeep's weight, moments about its pin, give its axles' load; the rest is its pin's.
 * 3. Tractor: the fifth-wheel load (kingpin or jeep pin) and the tractor's weight, moments about the steer group,
 *    give the drive group's load; the rest is the steer group's.
 */
function solve(input: AxleGroupLoadsInput): Solved {
  const { tractor, trailer, loads, jeep, booster } = input;
  const fifthWheelFt = tractor.wheelbaseFt - tractor.fifthWheelAheadOfDriveFt;
  const kingpinFt = jeep ? fifthWheelFt + jeep.fifthWheelBehindPinFt : fifthWheelFt;

  // 1. Trailer and booster.
  const trailerGroups: { key: string; label: string; p: Placed }[] = [
    { key: 'trailer', label: 'Trailer group', p: place(trailer.group, kingpinFt + trailer.axleGroupFromKingpinFt) },
    ...(trailer.moreGroups ?? []).map((g, i) => ({ key: `trailer-${i + 2}`, label: `Trailer group ${i + 2}`, p: place(g, kingpinFt + g.centerFromKingpinFt) })),
  ];
  let weight = trailer.tareLb;
  let moment = trailer.tareLb * trailer.tareCgFromKingpinFt;
  for (const l of loads) {
    weight += l.weightLb;
    moment += l.weightLb * l.cgFromKingpinFt;
  }
  const trailerAxleCount = (p: Placed): number => p.downPositions.length;
  const nTrailer = trailerGroups.reduce((s, g) => s + trailerAxleCount(g.p), 0);
  const trailerCenter = trailerGroups.reduce((s, g) => s + g.p.downPositions.reduce((a, x) => a + x, 0), 0) / nTrailer;
  let trailerLb: number;
  let boosterLb: number | null = null;
  let boosterPinLb: number | null = null;
  let boosterPinMomentLbFt: number | null = null;
  let boosterPlaced: Placed | null = null;
  if (booster) {
    const pinFt = kingpinFt + booster.pinFromKingpinFt;
    boosterPlaced = place(booster.group, pinFt + booster.axleGroupBehindPinFt);
    const bCg = pinFt + booster.tareCgBehindPinFt;
    const W = weight + booster.tareLb;
    const M = moment + booster.tareLb * (bCg - kingpinFt);
    const bCenter = boosterPlaced.center;
    if (booster.pinLoadLb === undefined) {
      // Equalized: every axle down on the trailer and the booster carries the same load q.
      const nB = boosterPlaced.downPositions.length;
      const sumX = trailerGroups.reduce((s, g) => s + g.p.downPositions.reduce((a, x) => a + x, 0), 0) + boosterPlaced.downPositions.reduce((a, x) => a + x, 0);
      const n = nTrailer + nB;
      const center = sumX / n;
      const all = M / (center - kingpinFt);
      const q = all / n;
      trailerLb = q * nTrailer;
      boosterLb = q * nB;
    } else {
      boosterLb = booster.pinLoadLb + booster.tareLb;
      trailerLb = (M - boosterLb * (bCenter - kingpinFt)) / (trailerCenter - kingpinFt);
    }
    boosterPinLb = boosterLb - booster.tareLb;
    boosterPinMomentLbFt = boosterLb * (bCenter - pinFt) - booster.tareLb * (bCg - pinFt);
    weight = W;
  } else {
    trailerLb = moment / (trailerCenter - kingpinFt);
  }
  const kingpinLb = weight - trailerLb - (boosterLb ?? 0);

  // 2. Jeep.
  let jeepLb: number | null = null;
  let jeepPinLb: number | null = null;
  let jeepPlaced: Placed | null = null;
  if (jeep) {
    jeepPlaced = place(jeep.group, fifthWheelFt + jeep.axleGroupBehindPinFt);
    const lever = jeepPlaced.center - fifthWheelFt;
    jeepLb = (kingpinLb * (kingpinFt - fifthWheelFt) + jeep.tareLb * jeep.tareCgBehindPinFt) / lever;
    jeepPinLb = kingpinLb + jeep.tareLb - jeepLb;
  }
  const fifthWheelLb = jeepPinLb ?? kingpinLb;

  // 3. Tractor: its tare as scaled (steer at 0, drive at the wheelbase), the fifth-wheel load, reactions at the
  // centers of the axles down.
  const steerP = place(tractor.steerGroup, 0, true);
  const driveP = place(tractor.driveGroup, tractor.wheelbaseFt);
  const tareMomentAboutSteer = tractor.driveTareLb * (tractor.wheelbaseFt - steerP.center) - tractor.steerTareLb * steerP.center;
  const driveLb = (tareMomentAboutSteer + fifthWheelLb * (fifthWheelFt - steerP.center)) / (driveP.center - steerP.center);
  const steerLb = tractor.steerTareLb + tractor.driveTareLb + fifthWheelLb - driveLb;

  const groups: GroupLoad[] = [
    groupLoad('steer', 'tractor', 'Steer', steerP, steerLb),
    groupLoad('drive', 'tractor', 'Drive group', driveP, driveLb),
  ];
  if (jeepPlaced && jeepLb !== null) groups.push(groupLoad('jeep', 'jeep', 'Jeep', jeepPlaced, jeepLb));
  // Trailer groups share the trailer's axle load equally per axle down.
  for (const g of trailerGroups) groups.push(groupLoad(g.key, 'trailer', g.label, g.p, (trailerLb * trailerAxleCount(g.p)) / nTrailer));
  if (boosterPlaced && boosterLb !== null) groups.push(groupLoad('booster', 'booster', 'Booster', boosterPlaced, boosterLb));
  groups.sort((a, b) => a.centerFt - b.centerFt);

  const totalWeightLb =
    tractor.steerTareLb + tractor.driveTareLb + trailer.tareLb + (jeep?.tareLb ?? 0) + (booster?.tareLb ?? 0) + loads.reduce((s, l) => s + l.weightLb, 0);
  return { steerLb, driveLb, trailerLb, kingpinLb, fifthWheelLb, jeepPinLb, jeepLb, boosterLb, boosterPinLb, boosterPinMomentLbFt, totalWeightLb, groups };
}

const lb = (n: number): string => formatPounds(Math.max(0, n));

/**
 * Every group's load, the kingpin, jeep-pin and booster-pin loads and the gross, by static equilibrium. Today's
 * input (tractor, one trailer group, loads) gives today's answer; a jeep, more trailer groups, a booster, lift
 * axles and axle layouts extend it.
 */
export function axleGroupLoads(input: AxleGroupLoadsInput): AxleGroupLoadsResult {
  validateInput(input);
  const r = solve(input);
  const grossLb = r.totalWeightLb;
  const { steerLb, driveLb, trailerLb, kingpinLb } = r;
  const warnings: string[] = [];
  if (kingpinLb < 0) warnings.push('the kingpin load is negative: the load sits too far rearward and would lift the trailer off the fifth wheel');
  if (trailerLb < 0) warnings.push('the trailer group load is negative: the load sits too far forward of the kingpin');
  if (steerLb < 0) warnings.push('the steer axle load is negative: the fifth wheel is set too far forward');
  if (driveLb < 0) warnings.push('the drive group load is negative: the fifth-wheel load lifts the drive axles');
  if (r.jeepPinLb !== null && r.jeepPinLb < 0) warnings.push("the jeep pin load is negative: the jeep would lift the tractor's fifth wheel; move the jeep's fifth wheel forward");
  if (r.jeepLb !== null && r.jeepLb < 0) warnings.push("the jeep's axle load is negative: its fifth wheel sits ahead of what its axles can carry");
  if (r.boosterLb !== null && r.boosterLb < 0) warnings.push("the booster's axle load is negative: it would lift off the road");
  if (r.boosterPinLb !== null && r.boosterPinLb < 0) warnings.push('the booster pin load is negative: the booster hangs on the trailer instead of carrying it');

  let steerShare: SteerShareCheck | null = null;
  if (input.steerMinShareOfUnloaded !== undefined && input.tractor.steerTareLb > 0) {
    const minShare = input.steerMinShareOfUnloaded;
    const s = steerLb / input.tractor.steerTareLb;
    steerShare = { unloadedLb: input.tractor.steerTareLb, loadedLb: steerLb, share: s, minShare, ok: s + 1e-12 >= minShare, source: SOURCES.practice };
    if (!steerShare.ok) {
      warnings.push(
        `the steer axle carries ${lb(steerLb)}, ${Math.round(s * 100)} % of its unloaded ${formatPounds(input.tractor.steerTareLb)}, below the ${Math.round(
          minShare * 100,
        )} % kept for steering (common practice, no published source)`,
      );
    }
  }

  const sumOfGroupsLb = r.groups.reduce((s, g) => s + g.loadLb, 0);
  const differenceLb = sumOfGroupsLb - grossLb;
  const reasons: Reason[] = [
    {
      code: 'statics',
      message: `moments about the kingpin put ${lb(trailerLb)} on the trailer group and ${lb(kingpinLb)} on the kingpin, split ${lb(steerLb)} steer / ${lb(driveLb)} drive`,
      value: grossLb,
      unit: 'lb',
      source: SOURCES.statics,
    },
  ];
  if (r.jeepLb !== null) {
    reasons.push({
      code: 'statics-jeep',
      message: `moments about the jeep pin put ${lb(r.jeepLb)} of the kingpin's ${lb(kingpinLb)} and the jeep's weight on its axles and ${lb(r.jeepPinLb!)} on its pin (the tractor's fifth wheel)`,
      value: r.jeepPinLb!,
      unit: 'lb',
      source: SOURCES.statics,
    });
  }
  if (r.boosterLb !== null) {
    reasons.push({
      code: 'statics-booster',
      message: `${input.booster!.pinLoadLb === undefined ? 'set to equalize, ' : ''}the booster carries ${lb(r.boosterLb)}; ${lb(r.boosterPinLb!)} of it comes from the trailer at the pin`,
      value: r.boosterPinLb!,
      unit: 'lb',
      source: SOURCES.statics,
    });
  }
  return {
    steerLb,
    driveLb,
    trailerLb,
    kingpinLb,
    grossLb,
    warnings,
    reasons,
    caution: PLANNING_CAUTION,
    groups: r.groups,
    fifthWheelLb: r.fifthWheelLb,
    jeepPinLb: r.jeepPinLb,
    jeepLb: r.jeepLb,
    boosterLb: r.boosterLb,
    boosterPinLb: r.boosterPinLb,
    boosterPinMomentLbFt: r.boosterPinMomentLbFt,
    balance: { totalWeightLb: grossLb, sumOfGroupsLb, differenceLb, ok: Math.abs(differenceLb) <= 1e-6 * Math.max(1, grossLb) },
    steerShare,
  };
}

/**
 * The combination's axles front to rear for `checkAxleWeights`, from a result whose every group describes its
 * axles: each with its group key, load, tires, lift state and the steer flag.
 */
export function combinationAxleList(result: Pick<AxleGroupLoadsResult, 'groups'>): AxleInput[] {
  const out: AxleInput[] = [];
  for (const g of result.groups) {
    if (g.axles.length === 0) throw new RangeError(`${g.label}: describe its axles (axleCount, spacing) to list them`);
    for (const a of g.axles) {
      out.push({
        positionFt: a.positionFt,
        weightLb: Math.max(0, a.weightLb),
        group: g.key,
        ...(a.lifted ? { lifted: true } : {}),
        ...(g.key === 'steer' ? { steer: true } : {}),
        ...(g.tires ? { tires: g.tires } : {}),
      });
    }
  }
  return out.sort((a, b) => a.positionFt - b.positionFt);
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
  /**
   * Per-group limits. Absent, each group takes its own limit by axle count and spread (single, tandem, the bridge
   * formula, a tridem or quad figure in `axleLimits`), from its axles (`steerGroup`, `driveGroup`, `trailer.group`)
   * or the layout; a group whose axles are not described is taken as a tandem (34,000 lb) and the answer says so.
   */
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

type LimitOf = { limitLb: number | null; words: string; assumed: boolean };

/** A group's own limit by axle count and spread, from its described axles or offsets. */
function ownLimit(count: number | null, spreadFt: number | null, limits: Partial<AxleLimits>, fallbackLb: number | null, what: string): LimitOf {
  if (count === null || spreadFt === null) {
    return fallbackLb === null
      ? { limitLb: null, words: `${what}: axles not described`, assumed: true }
      : { limitLb: fallbackLb, words: `${what}: axles not described, taken as a tandem (${formatPounds(fallbackLb)})`, assumed: true };
  }
  const g = groupLimit(count, spreadFt, limits);
  return { limitLb: g.limitLb, words: `${what}: ${g.words}`, assumed: false };
}

const spreadOf = (offsets: number[]): number => (offsets.length > 1 ? offsets[offsets.length - 1] - offsets[0] : 0);

function describedCount(spec: AxleGroupSpec | undefined, offsets: number[] | undefined): { count: number | null; spread: number | null } {
  if (spec) {
    const p = place(spec, 0);
    return { count: p.downPositions.length, spread: p.downPositions[p.downPositions.length - 1] - p.downPositions[0] };
  }
  if (offsets && offsets.length > 0) return { count: offsets.length, spread: spreadOf(offsets) };
  return { count: null, spread: null };
}

/** Violations of a solved combination beyond the three main groups: negative reactions and the other groups' limits. */
function hingeViolations(r: Solved): string[] {
  const v: string[] = [];
  if (r.kingpinLb < 0) v.push('negative kingpin load');
  if (r.jeepPinLb !== null && r.jeepPinLb < 0) v.push('negative jeep pin load');
  if (r.jeepLb !== null && r.jeepLb < 0) v.push('negative jeep axle load');
  if (r.boosterLb !== null && r.boosterLb < 0) v.push('negative booster axle load');
  if (r.boosterPinLb !== null && r.boosterPinLb < 0) v.push('negative booster pin load');
  for (const g of r.groups) if (g.loadLb < -1e-9 && g.unit === 'trailer') v.push(`negative ${g.label.toLowerCase()} load`);
  return v;
}

/**
 * Searches the slider's range, hole by hole, for settings that keep every group legal; prefers the most
 * balanced one (lowest highest load-to-limit ratio). Says so when none exists. Each group is held to its own limit
 * by axle count and spread; a jeep, further trailer groups and a booster in the input are checked too.
 */
export function suggestSliderPosition(input: SliderSuggestionInput): SliderSuggestion {
  validateInput(input);
  const { slider } = input;
  checkNumber('slider.minFromKingpinFt', slider.minFromKingpinFt, { min: 0, minExclusive: true, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber('slider.maxFromKingpinFt', slider.maxFromKingpinFt, { min: slider.minFromKingpinFt, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber('slider.holeSpacingIn', slider.holeSpacingIn, { min: 0, minExclusive: true, max: 120, unit: 'in' });
  const steps = Math.floor(((slider.maxFromKingpinFt - slider.minFromKingpinFt) * 12) / slider.holeSpacingIn + 1e-9);
  if (steps > 1000) throw new RangeError(`slider: at most 1000 hole positions (absurd value); got ${steps + 1}`);
  const al: Partial<AxleLimits> = input.axleLimits ?? {};
  const steerAxles = describedCount(input.tractor.steerGroup, undefined);
  const steer = input.groupLimits?.steerLb ?? ownLimit(steerAxles.count ?? 1, steerAxles.spread ?? 0, al, null, 'steer').limitLb ?? Infinity;
  const driveAxles = describedCount(input.tractor.driveGroup, input.layout?.driveAxleOffsetsFt);
  const trailerAxles = describedCount(input.trailer.group, input.layout?.trailerAxleOffsetsFt);
  const driveOwn = ownLimit(driveAxles.count, driveAxles.spread, al, FEDERAL_AXLE_LIMITS.tandemLb, 'drive group');
  const trailerOwn = ownLimit(trailerAxles.count, trailerAxles.spread, al, FEDERAL_AXLE_LIMITS.tandemLb, 'trailer group');
  const gl: GroupLimits = {
    steerLb: steer,
    driveLb: input.groupLimits?.driveLb ?? driveOwn.limitLb ?? Infinity,
    trailerLb: input.groupLimits?.trailerLb ?? trailerOwn.limitLb ?? Infinity,
  };
  const notes: string[] = [];
  if (input.groupLimits?.driveLb === undefined && driveOwn.assumed) notes.push(driveOwn.words);
  if (input.groupLimits?.trailerLb === undefined && trailerOwn.assumed) notes.push(trailerOwn.words);
  const candidates: SliderCandidate[] = [];
  for (let s = 0; s <= steps; s++) {
    const at = slider.minFromKingpinFt + (s * slider.holeSpacingIn) / 12;
    const trailer = { ...input.trailer, axleGroupFromKingpinFt: at };
    const r = solve({ ...input, trailer });
    const violations: string[] = [];
    const ratio = (load: number, limit: number): number => (limit === Infinity ? 0 : load / limit);
    let utilisation = Math.max(ratio(r.steerLb, gl.steerLb), ratio(r.driveLb, gl.driveLb), ratio(r.trailerLb, gl.trailerLb));
    if (r.steerLb > gl.steerLb) violations.push(`steer ${formatPounds(r.steerLb)} over ${formatPounds(gl.steerLb)}`);
    violations.push(...hingeViolations(r));
    // Jeep, further trailer groups and booster: each against its own limit where its axles are described.
    for (const g of r.groups) {
      if (g.key === 'steer' || g.key === 'drive' || g.key === 'trailer' || g.axleCount === null || g.spreadFt === null) continue;
      const own = groupLimit(g.axleCount, g.spreadFt, al);
      if (own.limitLb === null) continue;
      utilisation = Math.max(utilisation, g.loadLb / own.limitLb);
      if (g.loadLb > own.limitLb + 1e-6) violations.push(`${g.label.toLowerCase()} ${formatPounds(g.loadLb)} over ${formatPounds(own.limitLb)} (${own.words})`);
    }
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
  const reasons: Reason[] = [{ code: 'slider-search', message, source: `${SOURCES.statics}; ${SOURCES.usc127}` }];
  for (const n of notes) reasons.push({ code: 'slider-group-assumed', message: n, source: SOURCES.cfr658_5 });
  return { found: best !== null, best, candidates, message, reasons, caution: PLANNING_CAUTION };
}

/** A range of settings of a movable part, searched hole by hole. */
export type PositionRange = { minFt: number; maxFt: number; stepIn: number };

export type CombinationSearchInput = AxleGroupLoadsInput & {
  /** The trailer's sliding group: its center behind the kingpin. */
  trailerGroupRange?: PositionRange;
  /** The jeep's sliding fifth wheel: behind the jeep's pin. */
  jeepFifthWheelRange?: PositionRange;
  /** The booster's axle group behind its pin (its extension). */
  boosterRange?: PositionRange;
  /** Legal or permit limits (federal by default). */
  limits?: Partial<AxleLimits>;
  /** Limits by group key (`steer`, `drive`, `jeep`, `trailer`, `trailer-2`, `booster`) that replace the group's own. */
  groupLimits?: Record<string, number>;
};

export type CombinationSetting = {
  trailerGroupFromKingpinFt: number;
  jeepFifthWheelBehindPinFt: number | null;
  boosterAxleGroupBehindPinFt: number | null;
};

export type CombinationGroupCheck = { key: string; label: string; loadLb: number; limitLb: number | null; words: string };

export type CombinationCandidate = CombinationSetting & {
  groups: CombinationGroupCheck[];
  ok: boolean;
  /** Highest load-to-limit ratio over the groups (lower = more balanced). */
  utilisation: number;
  violations: string[];
};

export type CombinationSuggestion = {
  found: boolean;
  best: CombinationCandidate | null;
  /** Settings tried. */
  tried: number;
  /** The legal settings, most balanced first. */
  legal: CombinationCandidate[];
  message: string;
  reasons: Reason[];
  caution: string;
};

function settings(field: string, r: PositionRange | undefined, current: number | null): number[] {
  if (!r) return current === null ? [NaN] : [current];
  checkNumber(`${field}.minFt`, r.minFt, { min: 0, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber(`${field}.maxFt`, r.maxFt, { min: r.minFt, max: ABSURD.lengthFt, unit: 'ft' });
  checkNumber(`${field}.stepIn`, r.stepIn, { min: 0, minExclusive: true, max: 120, unit: 'in' });
  const steps = Math.floor(((r.maxFt - r.minFt) * 12) / r.stepIn + 1e-9);
  if (steps > 1000) throw new RangeError(`${field}: at most 1000 positions (absurd value); got ${steps + 1}`);
  return Array.from({ length: steps + 1 }, (_, i) => Math.round((r.minFt + (i * r.stepIn) / 12) * 1000) / 1000);
}

/**
 * Searches the movable parts — the trailer's sliding group, the jeep's fifth wheel, the booster's extension — over
 * their ranges for settings that keep every group within its limit (its own by axle count and spread, or the one
 * given by key) and, when every group's axles are described, every axle, run of axles, tire and the gross within
 * `checkAxleWeights`. Prefers the most balanced setting. Says so when none exists.
 */
export function suggestCombinationSettings(input: CombinationSearchInput): CombinationSuggestion {
  validateInput(input);
  if (input.jeepFifthWheelRange && !input.jeep) throw new RangeError('jeepFifthWheelRange needs a jeep');
  if (input.boosterRange && !input.booster) throw new RangeError('boosterRange needs a booster');
  const trailerAt = settings('trailerGroupRange', input.trailerGroupRange, input.trailer.axleGroupFromKingpinFt);
  const jeepAt = settings('jeepFifthWheelRange', input.jeepFifthWheelRange, input.jeep ? input.jeep.fifthWheelBehindPinFt : null);
  const boosterAt = settings('boosterRange', input.boosterRange, input.booster ? input.booster.axleGroupBehindPinFt : null);
  const tried = trailerAt.length * jeepAt.length * boosterAt.length;
  if (tried > 20_000) throw new RangeError(`the ranges give ${tried} settings; at most 20,000 (absurd value)`);
  const limits: Partial<AxleLimits> = input.limits ?? {};
  const legal: CombinationCandidate[] = [];
  let closest: CombinationCandidate | null = null;
  for (const t of trailerAt) {
    for (const j of jeepAt) {
      for (const b of boosterAt) {
        const variant: AxleGroupLoadsInput = {
          ...input,
          trailer: { ...input.trailer, axleGroupFromKingpinFt: t },
          ...(input.jeep ? { jeep: { ...input.jeep, fifthWheelBehindPinFt: j } } : {}),
          ...(input.booster ? { booster: { ...input.booster, axleGroupBehindPinFt: b } } : {}),
        };
        const r = solve(variant);
        const violations = hingeViolations(r);
        let utilisation = 0;
        const groups: CombinationGroupCheck[] = r.groups.map((g) => {
          const given = input.groupLimits?.[g.key];
          let limitLb: number | null;
          let words: string;
          if (given !== undefined) {
            limitLb = checkNumber(`groupLimits.${g.key}`, given, { min: 0, minExclusive: true, max: ABSURD.weightLb, unit: 'lb' });
            words = 'limit given';
          } else if (g.axleCount !== null && g.spreadFt !== null) {
            const own = groupLimit(g.axleCount, g.spreadFt, limits);
            limitLb = own.limitLb;
            words = own.words;
          } else if (g.key === 'steer') {
            limitLb = { ...FEDERAL_AXLE_LIMITS, ...limits }.singleAxleLb;
            words = 'single axle';
          } else {
            limitLb = null;
            words = 'axles not described: no group limit checked';
          }
          if (limitLb !== null) {
            utilisation = Math.max(utilisation, g.loadLb / limitLb);
            if (g.loadLb > limitLb + 1e-6) violations.push(`${g.label.toLowerCase()} ${formatPounds(g.loadLb)} over ${formatPounds(limitLb)} (${words})`);
          }
          return { key: g.key, label: g.label, loadLb: g.loadLb, limitLb, words };
        });
        if (r.groups.every((g) => g.axles.length > 0) && violations.length === 0) {
          const check = checkAxleWeights(combinationAxleList(r), limits);
          for (const v of check.violations) violations.push(v.message);
          for (const f of check.findingViolations) violations.push(f.message);
        }
        const c: CombinationCandidate = {
          trailerGroupFromKingpinFt: t,
          jeepFifthWheelBehindPinFt: input.jeep ? j : null,
          boosterAxleGroupBehindPinFt: input.booster ? b : null,
          groups,
          ok: violations.length === 0,
          utilisation,
          violations,
        };
        if (c.ok) legal.push(c);
        else if (!closest || c.violations.length < closest.violations.length) closest = c;
      }
    }
  }
  legal.sort((a, b) => a.utilisation - b.utilisation);
  const best = legal[0] ?? null;
  const where = (c: CombinationCandidate): string =>
    [
      `trailer group ${c.trailerGroupFromKingpinFt} ft behind the kingpin`,
      ...(c.jeepFifthWheelBehindPinFt !== null ? [`jeep fifth wheel ${c.jeepFifthWheelBehindPinFt} ft behind its pin`] : []),
      ...(c.boosterAxleGroupBehindPinFt !== null ? [`booster axles ${c.boosterAxleGroupBehindPinFt} ft behind its pin`] : []),
    ].join(', ');
  const message = best
    ? `set the ${where(best)}: every group legal, highest group at ${Math.round(best.utilisation * 100)} % of its limit`
    : `no setting of the movable parts keeps every group within its limit${closest ? ` (closest: ${closest.violations.join('; ')})` : ''}: move the load, change equipment or permit the weight`;
  return {
    found: best !== null,
    best,
    tried,
    legal,
    message,
    reasons: [{ code: 'combination-search', message, source: `${SOURCES.statics}; ${SOURCES.usc127}` }],
    caution: PLANNING_CAUTION,
  };
}
