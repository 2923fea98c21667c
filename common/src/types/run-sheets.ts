import type { OpenQuestion } from '../engine/assess-jurisdiction';
import type { DimensionsResult } from '../engine/dimensions';
import type { GaugeEstimate } from '../engine/air-gauge';
import type { MarkingsResult } from '../engine/markings';
import type { PlanCheckResult } from '../engine/plan-check';
import type { TravelWindowsResult } from '../engine/travel-windows';
import type { SecurementResult } from '../engine/securement';
import type { MoveDto } from './moves';

/** How far measured dimensions may exceed the planned or permitted ones before departure is blocked.
 * Common practice, no published source: a tape read on a loaded trailer is good to about an inch. */
export const DEPARTURE_TOLERANCE_IN = { height: 1, width: 1, length: 6 } as const;

export type GaugeReading = { group: 'trailer'; psi: number };
/** A certified scale weight for an axle group, recorded by the driver (it answers a gauge estimate far off the plan). */
export type ScaleWeight = { group: 'trailer'; lb: number; ticket?: string };

/**
 * A gauge estimate more than this share off the planned group weight blocks "checks passed" until the driver
 * records a scale weight for the group or a dispatcher overrides with a reason. Common practice, no published
 * source: an air-suspension gauge read against a two-point calibration is good to roughly a tenth.
 */
export const GAUGE_PLAN_DIFF_LIMIT = 0.15;

export type DepartureChecksRequest = {
  measuredHeightIn: number;
  measuredWidthIn: number;
  measuredLengthIn: number;
  sliderPinsLocked: boolean;
  tiresInflated: boolean;
  markingsInPlace: boolean;
  permitsOnBoard: boolean;
  gaugeReadings: GaugeReading[];
  scaleWeights?: ScaleWeight[];
};

/** A dispatcher's decision to let blocked checks pass (only for gauge findings), with the reason. */
export type ChecksOverride = { by: { id: string; name: string }; reason: string; at: string };
export type OverrideChecksRequest = { reason: string };

export type CheckFinding = { code: string; message: string; blocking: boolean };

export type DepartureChecksDto = DepartureChecksRequest & {
  id: string;
  fingerprint: string;
  outcome: 'passed' | 'blocked';
  findings: CheckFinding[];
  override: ChecksOverride | null;
  gaugeEstimates: (GaugeEstimate & { group: string; plannedLb: number })[];
  submittedAt: string;
  driver: { id: string; name: string };
};

export type AcknowledgeRequest = { fingerprint: string };

export type RunSheetPermit = {
  jurisdiction: string;
  status: string;
  number: string | null;
  validFrom: string | null;
  validTo: string | null;
  conditions: string[];
  documentUrl: string | null;
  /** Set when the permit ends before the planned exit from its state. */
  warning: string | null;
};

export type RunSheetEscort = {
  jurisdiction: string | null;
  position: string;
  status: string;
  vendor: string | null;
  operator: string | null;
  phone: string | null;
  meetingPoint: string | null;
  meetingTime: string | null;
};

export type RunSheetDto = {
  move: MoveDto;
  /** Changes whenever the plan, a permit or an escort booking changes: an acknowledgement holds for one fingerprint. */
  fingerprint: string;
  generatedAt: string;
  dimensions: DimensionsResult;
  /** The dimensions departure is checked against: the smallest permitted, else the plan's. */
  checkAgainst: { heightIn: number; widthIn: number; lengthIn: number; source: 'permit' | 'plan' };
  markings: MarkingsResult;
  securement: (SecurementResult & { articleId: string })[];
  axles: { steerLb: number; driveLb: number; trailerLb: number; grossLb: number; sliderSettingFt: number | null; federal: PlanCheckResult['federal'] };
  travel: { jurisdiction: string; name: string; days: TravelWindowsResult[] }[];
  earliestDeparture: string | null;
  /** False when a travel topic of the first state is not on file: the departure time is then not the answer. */
  earliestDepartureKnown: boolean;
  /** Rulebook topics not on file for this load, per state, until a permit answers them. */
  openQuestions: OpenQuestion[];
  permits: RunSheetPermit[];
  escorts: RunSheetEscort[];
  gaugeCalibration: { psi: number; loadLb: number }[];
  cautions: string[];
  latestChecks: DepartureChecksDto | null;
  acknowledgement: { at: string; fingerprint: string; current: boolean } | null;
};
