import type { ScheduleResult } from '../moves/schedule';
import type { MoveStage } from '../moves/stages';
import type { PlanCheckResult, PlanArticle } from '../engine/plan-check';
import type { RoadType } from '../engine/jurisdiction-rule';
import type { Page } from './auth';
import type { AnchorKind } from './fleet';
import type { TiedownPath } from '../engine/securement';

export const WEIGHT_SOURCES = ['spec_sheet', 'scale_ticket', 'estimate'] as const;
export type WeightSource = (typeof WEIGHT_SOURCES)[number];

/** One route segment as the dispatcher enters it. The server adds the point and time zone. */
export type RouteSegmentInput = {
  order: number;
  jurisdiction: string;
  roads: string;
  miles: number;
  roadType: RoadType;
  urban?: boolean;
  /** A ZIP code on the segment (for sun times); or lat/lon directly. */
  zip?: string;
  lat?: number;
  lon?: number;
};
export type RouteSegmentDto = RouteSegmentInput & { lat: number; lon: number; timeZone: string; place: string | null };

/** One planned tiedown. Its WLL is the marked value, or the 49 CFR 393.108 table value for its kind;
 * the anchor's rating comes from the trailer's anchor points of that kind. */
export type MoveTiedown = {
  label?: string;
  kind: 'chain' | 'webbing' | 'other';
  /** Chain nominal size, e.g. '3/8'. */
  chainSize?: string;
  /** Chain grade; unmarked chain counts as grade 30. */
  chainGrade?: 30 | 43 | 70 | 80 | 100;
  /** Webbing width in inches, e.g. '4'. */
  webbingWidth?: string;
  /** WLL marked on the tiedown; overrides the table (393.108(b)). Required for kind 'other'. */
  markedWllLb?: number;
  anchorKind: AnchorKind;
  path: TiedownPath;
  edgeProtection?: boolean;
};

/** A piece of cargo with its placement and tiedowns, as stored on the move. */
export type MoveArticle = Omit<PlanArticle, 'tiedowns'> & {
  description: string;
  weightSource: WeightSource;
  tiedowns: MoveTiedown[];
};

export type MoveInput = {
  customer: string;
  customerRef?: string;
  commodity: string;
  articles: MoveArticle[];
  tractorId: string;
  trailerId: string;
  /** Trailer axle-group center behind the kingpin (the sliding axle setting). */
  sliderSettingFt?: number | null;
  route: RouteSegmentInput[];
  origin: string;
  destination: string;
  /** `YYYY-MM-DD`. */
  requestedDeparture: string;
  /** Planned travel days from departure (1 = departs and arrives the same day). */
  travelDays: number;
  /** Miles a day for the day plan; null = the route's miles spread over the travel days. */
  dailyMiles?: number | null;
  driverId?: string | null;
  notes?: string;
};
export type UpdateMoveRequest = Partial<MoveInput> & { version: number };

export type MoveSummaryDto = {
  id: string;
  reference: string;
  customer: string;
  commodity: string;
  stage: MoveStage;
  origin: string;
  destination: string;
  requestedDeparture: string;
  jurisdictions: string[];
  driver: { id: string; name: string } | null;
  flags: { permitsNeeded: number; escorts: number; superload: boolean; problems: number; overweight: boolean };
  updatedAt: string;
};

export type MoveDto = Omit<MoveInput, 'route'> & {
  id: string;
  reference: string;
  stage: MoveStage;
  version: number;
  route: RouteSegmentDto[];
  travelDates: string[];
  tractor: { id: string; unitNumber: string };
  trailer: { id: string; unitNumber: string; type: string };
  driver: { id: string; name: string } | null;
  /** When the stage last changed (null while never changed). */
  stageChangedAt: string | null;
  createdAt: string;
  updatedAt: string;
};

export type MovesQuery = { page?: number; pageSize?: number; stage?: MoveStage; search?: string; sort?: 'departure' | '-departure' | 'updated' };
export type MovesPage = Page<MoveSummaryDto>;
export type StageCounts = Record<MoveStage, number>;

export type AssessmentDto = {
  moveId: string;
  moveVersion: number;
  computedAt: string;
  /** Rulebook version used per jurisdiction. */
  ruleVersions: Record<string, number>;
  /** True once the move has left `requested`: the assessment keeps these versions until re-assessed. */
  pinned: boolean;
  /** Jurisdictions whose rulebook has a newer version than the one this pinned assessment uses. */
  newerRules: { code: string; used: number; current: number }[];
  result: PlanCheckResult;
  caution: string;
};

/** The move's schedule check: its day plan against travel windows, issued permits and confirmed escorts. */
export type ScheduleDto = ScheduleResult & { moveId: string; moveVersion: number; /** False when the daily distance is the route spread over the travel days. */ dailyMilesSet: boolean };

/** What re-assessing with the current rules would change, shown before it is applied. */
export type ReassessmentPreview = {
  moveId: string;
  moveVersion: number;
  used: Record<string, number>;
  current: Record<string, number>;
  /** In words, one line per change (permit need, escorts, fee, travel windows, problems). */
  differences: string[];
  /** False for delivered and cancelled moves: their assessment never changes. */
  allowed: boolean;
};
export type ReassessRequest = { version: number; reason?: string };
/** Reopening a cancelled move (back to requested) or one delivered within REOPEN_DELIVERED_DAYS (back to running). */
export type ReopenRequest = { version: number; reason: string };
export const REOPEN_DELIVERED_DAYS = 7;

export type StageChangeRequest = { to: MoveStage; reason?: string; version?: number };
/** The 409 body's `details` when a transition is refused. */
export type UnmetCondition = { code: string; message: string; jurisdiction?: string };

export type HistoryEntryDto = {
  id: string;
  at: string;
  actor: { id: string; name: string } | null;
  entity: string;
  entityId: string;
  action: string;
  before: unknown;
  after: unknown;
  reason: string | null;
};
