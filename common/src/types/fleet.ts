import type { DeckSection } from '../engine/dimensions';
import type { SliderRange } from '../engine/axle-group-loads';
import type { GaugeCalibrationPoint } from '../engine/air-gauge';

export const TRAILER_TYPES = ['flatbed', 'step_deck', 'double_drop', 'removable_gooseneck', 'extendable_flatbed', 'lowboy'] as const;
export type TrailerType = (typeof TRAILER_TYPES)[number];
export const TRAILER_TYPE_LABELS: Record<TrailerType, string> = {
  flatbed: 'Flatbed',
  step_deck: 'Step deck',
  double_drop: 'Double drop',
  removable_gooseneck: 'Removable gooseneck',
  extendable_flatbed: 'Extendable flatbed',
  lowboy: 'Lowboy',
};

export const ANCHOR_KINDS = ['stake_pocket', 'winch_track', 'pipe_spool', 'd_ring', 'rub_rail'] as const;
export type AnchorKind = (typeof ANCHOR_KINDS)[number];
export const ANCHOR_KIND_LABELS: Record<AnchorKind, string> = {
  stake_pocket: 'Stake pocket',
  winch_track: 'Winch track (sliding winch)',
  pipe_spool: 'Pipe spool',
  d_ring: 'D-ring',
  rub_rail: 'Rub rail',
};

export type AnchorPoint = { kind: AnchorKind; countPerSide: number; wllLb: number };

export type TractorInput = {
  unitNumber: string;
  plate: string;
  steerTareLb: number;
  driveTareLb: number;
  wheelbaseFt: number;
  /** Kingpin ahead of the drive-group center (negative = behind). */
  fifthWheelAheadOfDriveFt: number;
  /** Sliding fifth wheel range, if any. */
  fifthWheelRangeFt?: { min: number; max: number } | null;
  bumperToSteerIn: number;
  widthIn: number;
  heightIn: number;
  /** Drive axles relative to the drive-group center, front to rear (tandem about [-2.1, 2.1]). */
  driveAxleOffsetsFt: number[];
};
export type TractorDto = TractorInput & { id: string; active: boolean; version: number; updatedAt: string };

export type TrailerInput = {
  unitNumber: string;
  type: TrailerType;
  lengthIn: number;
  widthIn: number;
  heightIn?: number | null;
  decks: DeckSection[];
  tareLb: number;
  tareCgFromKingpinFt: number;
  kingpinFromFrontIn: number;
  /** Trailer axles relative to the group center, front to rear. */
  axleOffsetsFt: number[];
  /** Group center behind the kingpin when the axles do not slide, or the usual setting. */
  axleGroupFromKingpinFt: number;
  slider?: SliderRange | null;
  anchorPoints: AnchorPoint[];
  gaugeCalibration: GaugeCalibrationPoint[];
  tireSize?: string | null;
};
export type TrailerDto = TrailerInput & { id: string; active: boolean; version: number; updatedAt: string };
