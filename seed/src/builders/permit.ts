import type { PermitStatus, PermitType } from '@amberline/common';
import type { Db } from '../db';

let counter = 0;
const unique = () => `${Date.now().toString(36).slice(-4)}${process.pid.toString(36)}${(counter++).toString(36)}`.toUpperCase();

export type SeedPermitInput = {
  moveId: string;
  jurisdiction: string;
  status?: PermitStatus;
  permitType?: PermitType;
  permitNumber?: string | null;
  /** ISO instants. */
  validFrom?: string | null;
  validTo?: string | null;
  estimatedFeeCents?: number | null;
  actualFeeCents?: number | null;
  refundable?: boolean | null;
  leadTimeDays?: number;
  assigneeId?: string | null;
};

/** One permit row for a move (an issued one gets a unique permit number unless given). */
export async function seedPermit(db: Db, input: SeedPermitInput): Promise<{ id: string; permitNumber: string | null }> {
  const status = input.status ?? 'to_file';
  const permitNumber = input.permitNumber !== undefined ? input.permitNumber : status === 'issued' ? `${input.jurisdiction}-${unique()}` : null;
  const [row] = await db.query(
    `INSERT INTO permits (move_id, jurisdiction, status, permit_type, permit_number, valid_from, valid_to, estimated_fee_cents, actual_fee_cents,
                          refundable, lead_time_days, assignee_id, issued_at, filed_at)
     VALUES ($1, $2, $3::varchar, $4, $5, $6, $7, $8, $9, $10, $11, $12,
             CASE WHEN $3::varchar = 'issued' THEN now() END, CASE WHEN $3::varchar IN ('filed','issued') THEN now() END)
     RETURNING id`,
    [
      input.moveId, input.jurisdiction, status, input.permitType ?? 'single_trip', permitNumber, input.validFrom ?? null, input.validTo ?? null,
      input.estimatedFeeCents ?? null, input.actualFeeCents ?? null, input.refundable ?? null, input.leadTimeDays ?? 2, input.assigneeId ?? null,
    ],
  );
  return { id: row.id, permitNumber };
}
