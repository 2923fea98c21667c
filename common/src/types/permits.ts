import type { PermitTravelTerms } from '../engine/permit-terms';
import type { MoveStage } from '../moves/stages';
import type { Page } from './auth';

/** A permit's life: filed with the state, issued (or rejected), flagged when the plan changes, or voided. */
export const PERMIT_STATUSES = ['to_file', 'filed', 'issued', 'rejected', 'needs_amendment', 'void'] as const;
export type PermitStatus = (typeof PERMIT_STATUSES)[number];

export const PERMIT_STATUS_LABELS: Record<PermitStatus, string> = {
  to_file: 'To file',
  filed: 'Filed',
  issued: 'Issued',
  rejected: 'Rejected',
  needs_amendment: 'Needs amendment',
  void: 'Void',
};

/** The statuses that still ask something of the permit desk: the queue shows these unless told otherwise. */
export const OPEN_PERMIT_STATUSES = ['to_file', 'filed', 'rejected', 'needs_amendment'] as const satisfies readonly PermitStatus[];

/** What the queue's status filter takes: one status, every open one, or (absent) every status but void. */
export type PermitQueueStatus = PermitStatus | 'open';

/** Which status may follow which. `needs_amendment` is also set by the server when the plan changes. */
export const PERMIT_TRANSITIONS: Record<PermitStatus, readonly PermitStatus[]> = {
  to_file: ['filed', 'void'],
  filed: ['issued', 'rejected', 'to_file', 'needs_amendment', 'void'],
  issued: ['needs_amendment', 'void'],
  rejected: ['filed', 'to_file', 'void'],
  needs_amendment: ['filed', 'void'],
  void: [],
};

export function canPermitTransition(from: PermitStatus, to: PermitStatus): boolean {
  return PERMIT_TRANSITIONS[from].includes(to);
}

export const PERMIT_TYPES = ['single_trip', 'annual', 'blanket', 'superload'] as const;
export type PermitType = (typeof PERMIT_TYPES)[number];
export const PERMIT_TYPE_LABELS: Record<PermitType, string> = {
  single_trip: 'Single trip',
  annual: 'Annual',
  blanket: 'Blanket',
  superload: 'Superload',
};

/** The dimensions and weights as permitted: copied from the plan when the permit is filed. */
export type PermittedFacts = {
  widthIn: number;
  heightIn: number;
  lengthIn: number;
  frontOverhangIn: number;
  rearOverhangIn: number;
  grossLb: number;
  steerLb: number;
  driveLb: number;
  trailerLb: number;
  /** Miles in this jurisdiction. */
  miles: number;
  /** The move's plan revision this was copied from. */
  planRevision: number;
};

/** Conditions printed on a permit, in a form the run sheet can use; anything else goes to `conditionsText`. */
export type PermitConditions = {
  /** False when the rulebook had the escort answer not on file for this load (counts are then a floor). */
  escortsKnown?: boolean;
  escortsFront?: number;
  escortsRear?: number;
  heightPole?: boolean;
  /** e.g. "30 min before sunrise to 30 min after sunset". */
  travelHours?: string;
  /** e.g. "no travel from noon the weekday before a holiday". */
  holidays?: string;
  maxSpeedMph?: number;
  utilityContacts?: string[];
  /**
   * The permit's travel limits in structured form (hours, weekends, holidays, curfews). Once the permit is issued
   * they replace the rulebook's for this state on the run sheet and in the move's travel windows.
   */
  travel?: PermitTravelTerms;
};

/** How soon the permit must be filed: from the departure date and the state's lead time. */
export type PermitUrgency = 'overdue' | 'due_soon' | 'upcoming' | 'settled';
export const PERMIT_URGENCY_LABELS: Record<PermitUrgency, string> = {
  overdue: 'Overdue',
  due_soon: 'Due soon',
  upcoming: 'Upcoming',
  settled: 'Settled',
};

/** Days before the file-by date at which an open permit counts as due soon. */
export const PERMIT_DUE_SOON_DAYS = 3;

/**
 * Urgency of a permit: settled once issued or void; otherwise overdue when the file-by date (departure minus the
 * state's lead time) has passed, due soon within PERMIT_DUE_SOON_DAYS, else upcoming. Dates are `YYYY-MM-DD`.
 */
export function permitUrgency(status: PermitStatus, fileBy: string, today: string): { urgency: PermitUrgency; daysLeft: number } {
  const daysLeft = Math.round((Date.parse(`${fileBy}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
  if (status === 'issued' || status === 'void') return { urgency: 'settled', daysLeft };
  if (daysLeft < 0) return { urgency: 'overdue', daysLeft };
  if (daysLeft <= PERMIT_DUE_SOON_DAYS) return { urgency: 'due_soon', daysLeft };
  return { urgency: 'upcoming', daysLeft };
}

export const PAYMENT_STATUSES = ['pending', 'processing', 'succeeded', 'declined', 'failed', 'canceled', 'refunded'] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];
export const PAYMENT_STATUS_LABELS: Record<PaymentStatus, string> = {
  pending: 'Pending',
  processing: 'Awaiting confirmation',
  succeeded: 'Paid',
  declined: 'Declined',
  failed: 'Failed',
  canceled: 'Canceled',
  refunded: 'Refunded',
};

/** Test payment methods of the payment processor's test mode (no real card is ever charged here). */
export const TEST_PAYMENT_METHODS: readonly { id: string; label: string }[] = [
  { id: 'pm_card_visa', label: 'Test Visa — succeeds' },
  { id: 'pm_card_mastercard', label: 'Test Mastercard — succeeds' },
  { id: 'pm_card_chargeDeclined', label: 'Test card — declined' },
  { id: 'pm_card_chargeDeclinedInsufficientFunds', label: 'Test card — insufficient funds' },
  { id: 'pm_card_chargeDeclinedExpiredCard', label: 'Test card — expired' },
];

export type PermitDocumentDto = {
  id: string;
  version: number;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  uploadedAt: string;
  uploadedBy: { id: string; name: string } | null;
};

export type PaymentDto = {
  id: string;
  permitId: string;
  moveId: string;
  moveReference: string;
  jurisdiction: string;
  permitNumber: string | null;
  attempt: number;
  amountCents: number;
  amountUsd: number;
  currency: string;
  status: PaymentStatus;
  paymentMethod: string;
  stripePaymentIntentId: string | null;
  stripeChargeId: string | null;
  stripeRefundId: string | null;
  declineCode: string | null;
  failureMessage: string | null;
  createdAt: string;
  succeededAt: string | null;
  refundedAt: string | null;
  createdBy: { id: string; name: string } | null;
};

export type PermitSummaryDto = {
  id: string;
  version: number;
  moveId: string;
  moveReference: string;
  moveStage: MoveStage;
  customer: string;
  jurisdiction: string;
  jurisdictionName: string;
  /** IANA zone the validity window is read in. */
  timeZone: string;
  permitType: PermitType;
  status: PermitStatus;
  permitNumber: string | null;
  /** Planned departure, `YYYY-MM-DD`. */
  departure: string;
  /** Departure minus the state's lead time, `YYYY-MM-DD`. */
  fileBy: string;
  /** Null when the state's lead time is not on file (the file-by date is then the departure itself). */
  leadTimeDays: number | null;
  urgency: PermitUrgency;
  daysToFileBy: number;
  validFrom: string | null;
  validTo: string | null;
  estimatedFeeUsd: number | null;
  actualFeeUsd: number | null;
  paymentStatus: PaymentStatus | null;
  paid: boolean;
  documentCount: number;
  assignee: { id: string; name: string } | null;
  /** Why the permit needs an amendment (set by a plan change). */
  amendmentReason: string | null;
  /** Set by the daily expiry scan. */
  expiryWarning: string | null;
  updatedAt: string;
};

export type PermitVersionDto = {
  version: number;
  status: PermitStatus;
  reason: string | null;
  snapshot: Record<string, unknown>;
  createdAt: string;
  createdBy: { id: string; name: string } | null;
};

export type PermitDto = PermitSummaryDto & {
  filedAt: string | null;
  issuedAt: string | null;
  /** Validity as local wall-clock time in the jurisdiction's zone, `YYYY-MM-DDTHH:mm`. */
  validFromLocal: string | null;
  validToLocal: string | null;
  permitted: PermittedFacts | null;
  routeText: string | null;
  conditions: PermitConditions;
  conditionsText: string | null;
  notes: string | null;
  /** What the rule (at the version the permit was created from) says about refunds; null when it says nothing. */
  refundable: boolean | null;
  ruleVersion: number | null;
  needed: boolean;
  documents: PermitDocumentDto[];
  payments: PaymentDto[];
  history: PermitVersionDto[];
};

export type UpdatePermitRequest = {
  version: number;
  status?: PermitStatus;
  /** Why (required for reject and void). */
  reason?: string;
  permitType?: PermitType;
  permitNumber?: string | null;
  /** ISO instant. */
  issuedAt?: string | null;
  /** Local wall-clock in the jurisdiction's zone, `YYYY-MM-DDTHH:mm`. */
  validFrom?: string | null;
  validTo?: string | null;
  routeText?: string | null;
  conditions?: PermitConditions;
  conditionsText?: string | null;
  actualFeeUsd?: number | null;
  assigneeId?: string | null;
  notes?: string | null;
};

export const PERMIT_SORTS = ['urgency', 'departure', '-departure', 'jurisdiction', 'status', 'updated'] as const;
export type PermitSort = (typeof PERMIT_SORTS)[number];

export type PermitsQuery = {
  page?: number;
  pageSize?: number;
  /** One status, `open` for every open one (OPEN_PERMIT_STATUSES); absent for all but void. */
  status?: PermitQueueStatus;
  jurisdiction?: string;
  /** A user id, `me` or `none`. */
  assignee?: string;
  moveId?: string;
  sort?: PermitSort;
};
export type PermitsPage = Page<PermitSummaryDto>;

export type PermitOverviewDto = {
  counts: Record<PermitStatus, number>;
  overdue: number;
  expiringSoon: PermitSummaryDto[];
  needsAmendment: PermitSummaryDto[];
};

export type AssignPermitsRequest = { permitIds: string[]; assigneeId: string | null };
export type AssignPermitsResponse = { updated: number };

export type SyncPermitsResponse = { created: number; updated: number; permits: PermitSummaryDto[] };

export type PayPermitRequest = { paymentMethod: string; idempotencyKey: string };

export type PaymentsQuery = { page?: number; pageSize?: number; moveId?: string; status?: PaymentStatus; jurisdiction?: string };
export type PaymentsPage = Page<PaymentDto> & { totals: { succeededUsd: number; refundedUsd: number } };

/** Result of the daily scan. */
export type ExpiryScanResult = { ran: boolean; checked: number; flagged: { permitId: string; warning: string }[] };
