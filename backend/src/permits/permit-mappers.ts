import {
  fileByDate, jurisdictionByCode, localDate, permitUrgency, usd, zoneOf,
  type MoveStage, type PaymentDto, type PaymentStatus, type PermitConditions, type PermitDocumentDto, type PermitStatus, type PermitSummaryDto, type PermitType, type PermitVersionDto,
} from '@amberline/common';
import type { PermitDocument } from './entities/permit-document.entity';
import type { PermitPayment } from './entities/permit-payment.entity';
import type { PermitVersion } from './entities/permit-version.entity';

/** The columns the queue query selects (see permitSummarySql in permits.repository). */
export type PermitRow = {
  id: string;
  version: number;
  move_id: string;
  jurisdiction: string;
  permit_type: PermitType;
  status: PermitStatus;
  needed: boolean;
  permit_number: string | null;
  valid_from: Date | null;
  valid_to: Date | null;
  estimated_fee_cents: number | null;
  actual_fee_cents: number | null;
  lead_time_days: number;
  lead_time_known: boolean;
  assignee_id: string | null;
  assignee_name: string | null;
  amendment_reason: string | null;
  expiry_warning: string | null;
  updated_at: Date;
  move_reference: string;
  move_stage: MoveStage;
  customer: string;
  departure: string;
  document_count: number;
  payment_status: PaymentStatus | null;
};


/** `now` gives today's date in the permit's own state for the urgency. */
export function toSummaryDto(r: PermitRow, now: Date): PermitSummaryDto {
  const fileBy = fileByDate(r.departure, r.lead_time_days);
  const { urgency, daysLeft } = permitUrgency(r.status, fileBy, localDate(now.getTime(), zoneOf(r.jurisdiction)));
  return {
    id: r.id,
    version: r.version,
    moveId: r.move_id,
    moveReference: r.move_reference,
    moveStage: r.move_stage,
    customer: r.customer,
    jurisdiction: r.jurisdiction,
    jurisdictionName: jurisdictionByCode(r.jurisdiction)?.name ?? r.jurisdiction,
    timeZone: zoneOf(r.jurisdiction),
    permitType: r.permit_type,
    status: r.status,
    permitNumber: r.permit_number,
    departure: r.departure,
    fileBy,
    leadTimeDays: r.lead_time_known ? r.lead_time_days : null,
    urgency,
    daysToFileBy: daysLeft,
    validFrom: r.valid_from ? new Date(r.valid_from).toISOString() : null,
    validTo: r.valid_to ? new Date(r.valid_to).toISOString() : null,
    estimatedFeeUsd: usd(r.estimated_fee_cents),
    actualFeeUsd: usd(r.actual_fee_cents),
    paymentStatus: r.payment_status,
    paid: r.payment_status === 'succeeded',
    documentCount: r.document_count,
    assignee: r.assignee_id ? { id: r.assignee_id, name: r.assignee_name ?? '' } : null,
    amendmentReason: r.amendment_reason,
    expiryWarning: r.expiry_warning,
    updatedAt: new Date(r.updated_at).toISOString(),
  };
}

export const toDocumentDto = (d: PermitDocument): PermitDocumentDto => ({
  id: d.id,
  version: d.version,
  fileName: d.fileName,
  sizeBytes: d.sizeBytes,
  sha256: d.sha256,
  uploadedAt: d.uploadedAt.toISOString(),
  uploadedBy: d.uploadedBy ? { id: d.uploadedBy.id, name: d.uploadedBy.name } : null,
});

export const toVersionDto = (v: PermitVersion): PermitVersionDto => ({
  version: v.version,
  status: v.status,
  reason: v.reason,
  snapshot: v.snapshot as Record<string, unknown>,
  createdAt: v.createdAt.toISOString(),
  createdBy: v.createdBy ? { id: v.createdBy.id, name: v.createdBy.name } : null,
});

export type PaymentContext = { moveReference: string; jurisdiction: string; permitNumber: string | null };

export const toPaymentDto = (p: PermitPayment, ctx: PaymentContext): PaymentDto => ({
  id: p.id,
  permitId: p.permitId,
  moveId: p.moveId,
  moveReference: ctx.moveReference,
  jurisdiction: ctx.jurisdiction,
  permitNumber: ctx.permitNumber,
  attempt: p.attempt,
  amountCents: p.amountCents,
  amountUsd: p.amountCents / 100,
  currency: p.currency,
  status: p.status,
  paymentMethod: p.paymentMethod,
  stripePaymentIntentId: p.stripePaymentIntentId,
  stripeChargeId: p.stripeChargeId,
  stripeRefundId: p.stripeRefundId,
  declineCode: p.declineCode,
  failureMessage: p.failureMessage,
  createdAt: p.createdAt.toISOString(),
  succeededAt: p.succeededAt ? p.succeededAt.toISOString() : null,
  refundedAt: p.refundedAt ? p.refundedAt.toISOString() : null,
  createdBy: p.createdBy ? { id: p.createdBy.id, name: p.createdBy.name } : null,
});

/** What a version snapshot keeps of a permit (the fields a clerk or the plan can change). */
export function snapshotOf(p: {
  status: PermitStatus; permitType: PermitType; permitNumber: string | null; issuedAt: Date | null; filedAt: Date | null; validFrom: Date | null; validTo: Date | null;
  permitted: unknown; routeText: string | null; conditions: PermitConditions; conditionsText: string | null; estimatedFeeCents: number | null; actualFeeCents: number | null;
  assigneeId: string | null; notes: string | null; amendmentReason: string | null; needed: boolean; refundable: boolean | null; ruleVersion: number | null;
  leadTimeDays: number; leadTimeKnown?: boolean; expiryWarning: string | null;
}): Record<string, unknown> {
  const iso = (d: Date | null) => (d ? d.toISOString() : null);
  return {
    status: p.status, permitType: p.permitType, permitNumber: p.permitNumber, filedAt: iso(p.filedAt), issuedAt: iso(p.issuedAt), validFrom: iso(p.validFrom), validTo: iso(p.validTo),
    permitted: p.permitted, routeText: p.routeText, conditions: p.conditions, conditionsText: p.conditionsText, estimatedFeeCents: p.estimatedFeeCents,
    actualFeeCents: p.actualFeeCents, assigneeId: p.assigneeId, notes: p.notes, amendmentReason: p.amendmentReason, needed: p.needed,
    refundable: p.refundable, ruleVersion: p.ruleVersion, leadTimeDays: p.leadTimeDays, leadTimeKnown: p.leadTimeKnown ?? true, expiryWarning: p.expiryWarning,
  };
}
