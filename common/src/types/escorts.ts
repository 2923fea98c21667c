/** API contract of escort vendors, escort bookings and the vendor's answer through the e-mailed link. */

export const ESCORT_POSITIONS = ['lead', 'chase', 'height_pole'] as const;
export type EscortPosition = (typeof ESCORT_POSITIONS)[number];
export const ESCORT_POSITION_LABELS: Record<EscortPosition, string> = {
  lead: 'Lead (front)',
  chase: 'Chase (rear)',
  height_pole: 'Height pole (front)',
};

export const RATE_BASES = ['per_mile', 'per_day'] as const;
export type RateBasis = (typeof RATE_BASES)[number];

export type EscortCertification = {
  /** Postal code of the state that issued it. */
  state: string;
  number: string;
  /** `YYYY-MM-DD`. */
  expires: string;
};

export type EscortOperator = { name: string; phone?: string; certifications: EscortCertification[] };

export type EscortEquipment = { heightPole: boolean; amberLights: boolean; signs: boolean; flags: boolean };
export const EQUIPMENT_LABELS: Record<keyof EscortEquipment, string> = {
  heightPole: 'Height pole',
  amberLights: 'Amber lights',
  signs: 'OVERSIZE LOAD signs',
  flags: 'Flags',
};

export type EscortVehicle = { label: string; plate?: string; equipment: EscortEquipment };

export type VendorInsurance = {
  carrier?: string;
  policyNumber?: string;
  /** Liability limit per occurrence, USD. */
  liabilityLimitUsd: number;
  autoLimitUsd?: number;
  /** `YYYY-MM-DD`. */
  expires: string;
};

export type VendorRates = {
  basis: RateBasis;
  perMileUsd?: number;
  perDayUsd?: number;
  minimumUsd?: number;
  /** Paid when a run is called off after the escort has set out. */
  noGoUsd?: number;
  /** Per day of waiting (weather, curfew, holiday). */
  layoverUsd?: number;
};

export type VendorInput = {
  company: string;
  contactName: string;
  email: string;
  phone: string;
  /** Postal codes of the jurisdictions the vendor runs in. */
  states: string[];
  operators: EscortOperator[];
  insurance: VendorInsurance;
  vehicles: EscortVehicle[];
  rates: VendorRates;
  notes?: string;
  active?: boolean;
};
export type UpdateVendorRequest = VendorInput & { version: number };

export type VendorDto = Required<Omit<VendorInput, 'notes'>> & {
  id: string;
  notes: string | null;
  version: number;
  /** Expired insurance or certifications, as of today. */
  warnings: string[];
  createdAt: string;
  updatedAt: string;
};

export type VendorsQuery = { search?: string; state?: string; includeInactive?: boolean };

export const BOOKING_STATUSES = ['requested', 'confirmed', 'declined', 'proposed', 'cancelled'] as const;
export type BookingStatus = (typeof BOOKING_STATUSES)[number];
export const BOOKING_STATUS_LABELS: Record<BookingStatus, string> = {
  requested: 'Awaiting answer',
  confirmed: 'Confirmed',
  declined: 'Declined',
  proposed: 'Other dates proposed',
  cancelled: 'Called off',
};

export const ESCORT_DECISIONS = ['confirm', 'decline', 'propose'] as const;
export type EscortDecision = (typeof ESCORT_DECISIONS)[number];

export type EscortAnswer = {
  decision: EscortDecision;
  operatorName?: string;
  vehicle?: string;
  phone?: string;
  certifications?: { state: string; number: string }[];
  reason?: string;
  /** `YYYY-MM-DD`, for a proposal. */
  proposedStart?: string;
  proposedEnd?: string;
  note?: string;
};

export type EscortBookingDto = {
  id: string;
  moveId: string;
  vendor: { id: string; company: string; email: string; phone: string };
  position: EscortPosition;
  /** 1 for the first escort of that position, 2 for a second. */
  seat: number;
  jurisdictions: string[];
  startDate: string;
  endDate: string;
  meetingPoint: string;
  meetingTime: string | null;
  notes: string | null;
  status: BookingStatus;
  requestedAt: string;
  requestedBy: { id: string; name: string } | null;
  respondedAt: string | null;
  answer: EscortAnswer | null;
  cancelReason: string | null;
  /** Certification, insurance and equipment warnings found when the request was made or answered. */
  warnings: string[];
  linkExpiresAt: string | null;
  reminderSentAt: string | null;
  version: number;
};

export type CreateEscortBookingRequest = {
  vendorId: string;
  position: EscortPosition;
  seat: number;
  jurisdictions: string[];
  meetingPoint: string;
  /** `HH:MM`, local to the meeting point. */
  meetingTime?: string;
  notes?: string;
};
export type CancelEscortBookingRequest = { reason: string; version: number };

export type SlotCoverageStatus = 'confirmed' | 'proposed' | 'requested' | 'open';
export type EscortSlotDto = {
  position: EscortPosition;
  seat: number;
  label: string;
  /** Height pole setting, when the slot is the pole car. */
  heightPoleSetIn: number | null;
  jurisdictions: { code: string; name: string; status: SlotCoverageStatus; bookingId: string | null; vendor: string | null; reasons: string[] }[];
  satisfied: boolean;
};

export type MoveEscortsDto = {
  moveId: string;
  reference: string;
  stage: string;
  planRevision: number;
  travelDates: string[];
  needsEscorts: boolean;
  /** Jurisdictions whose escort answer is not on file for this load: the permit must say what it asks. */
  escortsNotOnFile: string[];
  slots: EscortSlotDto[];
  bookings: EscortBookingDto[];
  /** Jurisdictions on the route that ask for an escort certificate (sample data). */
  certificationStates: string[];
  caution: string;
};

/** What the vendor sees through the link. Never returned for an expired, used or unknown link. */
export type EscortRequestView = {
  vendor: {
    company: string;
    operators: { name: string; phone: string | null; certifications: { state: string; number: string }[] }[];
    vehicles: { label: string; plate: string | null }[];
  };
  requestedBy: { name: string; email: string } | null;
  move: {
    reference: string;
    commodity: string;
    origin: string;
    destination: string;
    travelDates: string[];
    dimensions: { widthIn: number; heightIn: number; lengthIn: number; frontOverhangIn: number; rearOverhangIn: number; grossLb: number };
    route: { order: number; jurisdiction: string; roads: string; miles: number; roadType: string }[];
  };
  position: EscortPosition;
  positionLabel: string;
  seat: number;
  jurisdictions: string[];
  startDate: string;
  endDate: string;
  meetingPoint: string;
  meetingTime: string | null;
  notes: string | null;
  heightPoleSetIn: number | null;
  certificationStates: string[];
  linkExpiresAt: string;
  caution: string;
};

export type EscortAnswerResult = { decision: EscortDecision; status: BookingStatus; message: string; warnings: string[] };

export const MAIL_STATUSES = ['pending', 'sent', 'failed'] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];
export type OutboxMessageDto = {
  id: string;
  to: string[];
  subject: string;
  status: MailStatus;
  attempts: number;
  nextAttemptAt: string | null;
  lastError: string | null;
  smtpMessageId: string | null;
  sentAt: string | null;
  createdAt: string;
};
