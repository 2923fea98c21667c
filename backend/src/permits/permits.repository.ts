import { Injectable } from '@nestjs/common';
import { DataSource, EntityManager, In, Not } from 'typeorm';
import { OPEN_PERMIT_STATUSES, type PermitConditions, type PermitSort, type PermitStatus } from '@amberline/common';
import { preparedQuery } from '../database/prepared';
import { PermitDocument } from './entities/permit-document.entity';
import { PermitPayment } from './entities/permit-payment.entity';
import { PermitVersion } from './entities/permit-version.entity';
import { Permit } from './entities/permit.entity';
import type { PermitRow } from './permit-mappers';

/** Move stages in which permits still matter (the expiry scan and the lists look only at these). */
export const ACTIVE_MOVE_STAGES = ['requested', 'permits_received', 'escorts_booked', 'running'] as const;
const ACTIVE = `m.stage IN (${ACTIVE_MOVE_STAGES.map((s) => `'${s}'`).join(',')})`;

const SORTS: Record<PermitSort, string> = {
  // open permits first, by the date they must be filed by, then departure (columns kept on the permit row, indexed)
  urgency: `p.urgency_group, p.file_by ASC, p.departure ASC`,
  departure: 'p.departure ASC, p.jurisdiction ASC',
  '-departure': 'p.departure DESC, p.jurisdiction ASC',
  jurisdiction: 'p.jurisdiction ASC, p.departure ASC',
  status: `array_position(ARRAY['to_file','needs_amendment','rejected','filed','issued','void']::varchar[], p.status), p.departure ASC`,
  updated: 'p.updated_at DESC',
};

/**
 * Everything the queue shows of a permit, one row per permit, with its move, assignee, PDFs and payment. `permits`
 * is the table, or a derived table of the permits wanted (a page picked on the permit's own columns first, so the
 * joins and per-permit look-ups run for those rows only).
 */
export const permitSummarySql = (permits = 'permits') => `
  SELECT p.id, p.version, p.move_id, p.jurisdiction, p.permit_type, p.status, p.needed, p.permit_number, p.valid_from, p.valid_to,
         p.estimated_fee_cents, p.actual_fee_cents, p.lead_time_days, p.lead_time_known, p.assignee_id, u.name AS assignee_name, p.amendment_reason,
         p.expiry_warning, p.updated_at, m.reference AS move_reference, m.stage AS move_stage, m.customer,
         to_char(m.requested_departure, 'YYYY-MM-DD') AS departure,
         (SELECT count(*)::int FROM permit_documents d WHERE d.permit_id = p.id) AS document_count,
         COALESCE(
           (SELECT 'succeeded' FROM permit_payments x WHERE x.permit_id = p.id AND x.status = 'succeeded' LIMIT 1),
           (SELECT x.status FROM permit_payments x WHERE x.permit_id = p.id ORDER BY x.attempt DESC LIMIT 1)
         ) AS payment_status
    FROM ${permits} p
    JOIN moves m ON m.id = p.move_id
    LEFT JOIN users u ON u.id = p.assignee_id`;
const PERMIT_SUMMARY_SQL = permitSummarySql();

/** The queue's filters, as the service resolved them (`assignee` a user id, or `none`). */
export type PermitFilter = { status?: 'open' | PermitStatus; jurisdiction?: string; moveId?: string; assignee?: string };

export type IssuedTermsRow = { jurisdiction: string; permit_number: string | null; issued_at: Date | null; conditions: PermitConditions | null };
export type RunSheetPermitRow = Pick<
  Permit,
  'id' | 'jurisdiction' | 'status' | 'permitNumber' | 'validFrom' | 'validTo' | 'permitted' | 'conditions' | 'conditionsText' | 'routeText' | 'amendmentReason' | 'expiryWarning'
> & { documentId: string | null };
export type ScanRow = { id: string; move_id: string; jurisdiction: string; valid_to: Date; expiry_warning: string | null; departure: string; travel_days: number };
export type WarningRecipients = { jurisdiction: string; permit_number: string | null; reference: string; move_id: string; clerks: string[] | null; dispatcher: string | null };
export type Assignee = { id: string; name: string; role: string; active: boolean };

/** The permits' SQL: the queue, the workflow's reads, locking and versioned writes, the expiry scan's rows. */
@Injectable()
export class PermitsRepository {
  constructor(private readonly ds: DataSource) {}

  transaction<T>(fn: (m: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  private m(manager?: EntityManager): EntityManager {
    return manager ?? this.ds.manager;
  }

  // ---------------------------------------------------------------- the queue

  summaries(where: string, params: unknown[], manager?: EntityManager, tail = ''): Promise<PermitRow[]> {
    return this.m(manager).query(`${PERMIT_SUMMARY_SQL} WHERE ${where} ${tail}`, params);
  }

  summariesByIds(ids: string[]): Promise<PermitRow[]> {
    return this.summaries('p.id = ANY($1)', [ids]);
  }

  liveSummariesOfMove(moveId: string): Promise<PermitRow[]> {
    return this.summaries(`p.move_id = $1 AND p.status <> 'void'`, [moveId], undefined, 'ORDER BY p.jurisdiction');
  }

  /** One page of the queue and the count of all that match; filters and sort keys live on the permit row. */
  async page(f: PermitFilter, sort: PermitSort, page: number, pageSize: number): Promise<{ rows: PermitRow[]; total: number }> {
    const where: string[] = [];
    const params: unknown[] = [];
    const add = (sql: string, v: unknown) => {
      params.push(v);
      where.push(sql.replace('?', `$${params.length}`));
    };
    if (f.status === 'open') where.push(`p.status IN (${OPEN_PERMIT_STATUSES.map((x) => `'${x}'`).join(',')})`);
    else if (f.status) add('p.status = ?', f.status);
    else where.push(`p.status <> 'void'`);
    if (f.jurisdiction) add('p.jurisdiction = ?', f.jurisdiction);
    if (f.moveId) add('p.move_id = ?', f.moveId);
    if (f.assignee === 'none') where.push('p.assignee_id IS NULL');
    else if (f.assignee) add('p.assignee_id = ?', f.assignee);
    const cond = where.length ? where.join(' AND ') : 'true';
    const [{ n }] = await preparedQuery<{ n: number }>(this.ds, `SELECT count(*)::int AS n FROM permits p WHERE ${cond}`, params);
    // the page is picked on the permit's own columns (filters and sort keys all live on the permit row, the move's
    // departure kept there by trigger), then joined, so the per-permit document and payment look-ups run for 20 rows
    const order = `${SORTS[sort] ?? SORTS.urgency}, p.id`;
    const sub = `(SELECT * FROM permits p WHERE ${cond} ORDER BY ${order} LIMIT $${params.length + 1} OFFSET $${params.length + 2})`;
    const rows = await preparedQuery<PermitRow>(this.ds, `${permitSummarySql(sub)} ORDER BY ${order}`, [...params, pageSize, (page - 1) * pageSize]);
    return { rows, total: n };
  }

  async countsByStatus(): Promise<{ status: PermitStatus; n: number }[]> {
    return this.ds.query(`SELECT status, count(*)::int AS n FROM permits GROUP BY status`);
  }

  /** Issued permits of active moves that expire within a week of `now` or carry an expiry warning. */
  expiringSoon(now: Date): Promise<PermitRow[]> {
    return this.summaries(
      `${ACTIVE} AND p.status = 'issued' AND (p.expiry_warning IS NOT NULL OR p.valid_to < $1::timestamptz + interval '7 days')`,
      [now.toISOString()],
      undefined,
      'ORDER BY p.valid_to ASC NULLS LAST, p.id LIMIT 50',
    );
  }

  needingAmendment(): Promise<PermitRow[]> {
    return this.summaries(`${ACTIVE} AND p.status = 'needs_amendment'`, [], undefined, 'ORDER BY m.requested_departure ASC, p.id LIMIT 50');
  }

  /** Open permits of active moves whose file-by date (the stored column, see fileByDate) is before `today`. */
  async countPastFileBy(today: string): Promise<number> {
    const [{ overdue }] = await this.ds.query(
      `SELECT count(*)::int AS overdue FROM permits p JOIN moves m ON m.id = p.move_id
        WHERE ${ACTIVE} AND p.status NOT IN ('issued','void') AND p.file_by < $1::date`,
      [today],
    );
    return overdue;
  }

  // ---------------------------------------------------------------- one permit, its parts

  /** The permit with the driver of its move (for the driver's visibility) and the move's reference. */
  async findWithMove(id: string, manager?: EntityManager): Promise<(Permit & { moveDriverId: string | null; moveReference: string }) | null> {
    const p = await this.m(manager).findOne(Permit, { where: { id }, relations: { move: true } });
    return p ? withMove(p) : null;
  }

  async ofMoveWithMove(moveId: string): Promise<(Permit & { moveDriverId: string | null; moveReference: string })[]> {
    const list = await this.ds.manager.find(Permit, { where: { moveId }, relations: { move: true }, order: { jurisdiction: 'ASC', createdAt: 'ASC' } });
    return list.map(withMove);
  }

  documentsOf(ids: string[]): Promise<PermitDocument[]> {
    return this.ds.manager.find(PermitDocument, { where: { permitId: In(ids) }, relations: { uploadedBy: true }, order: { version: 'DESC' } });
  }

  paymentsOf(ids: string[]): Promise<PermitPayment[]> {
    return this.ds.manager.find(PermitPayment, { where: { permitId: In(ids) }, relations: { createdBy: true }, order: { attempt: 'DESC' } });
  }

  versionsOf(ids: string[]): Promise<PermitVersion[]> {
    return this.ds.manager.find(PermitVersion, { where: { permitId: In(ids) }, relations: { createdBy: true }, order: { version: 'DESC' } });
  }

  // ---------------------------------------------------------------- locking and writing

  lock(m: EntityManager, id: string): Promise<Permit | null> {
    return m.findOne(Permit, { where: { id }, lock: { mode: 'pessimistic_write' } });
  }

  lockMany(m: EntityManager, ids: string[]): Promise<Permit[]> {
    return m.find(Permit, { where: { id: In(ids) }, order: { id: 'ASC' }, lock: { mode: 'pessimistic_write' } });
  }

  /** The move's permits that are not void, locked. */
  lockLiveOfMove(m: EntityManager, moveId: string): Promise<Permit[]> {
    return m.find(Permit, { where: { moveId, status: Not('void') }, lock: { mode: 'pessimistic_write' } });
  }

  countLiveOfMove(m: EntityManager, moveId: string): Promise<number> {
    return m.count(Permit, { where: { moveId, status: Not('void') } });
  }

  /** The move row locked for the permits' change, with its stage; null when there is no such move. */
  async lockMove(m: EntityManager, moveId: string): Promise<{ id: string; stage: string } | null> {
    const [row] = await m.query(`SELECT id, stage FROM moves WHERE id = $1 FOR UPDATE`, [moveId]);
    return row ?? null;
  }

  /** A new permit (version 1); the database fills its dates and urgency. */
  async insert(m: EntityManager, fields: Partial<Permit>): Promise<Permit> {
    return m.save(m.create(Permit, fields));
  }

  /** A copy to change and hand to `updateVersioned`. */
  copy(p: Permit, changes: Partial<Permit> = {}): Permit {
    return Object.assign(this.ds.manager.create(Permit, { ...p }), changes);
  }

  /** Writes `after` over the row if it is still at `before.version`; false when someone else changed it first. */
  async updateVersioned(m: EntityManager, before: Permit, after: Permit, now: Date): Promise<boolean> {
    const res = await m
      .createQueryBuilder()
      .update(Permit)
      .set({
        status: after.status, permitType: after.permitType, needed: after.needed, permitNumber: after.permitNumber, filedAt: after.filedAt, issuedAt: after.issuedAt,
        validFrom: after.validFrom, validTo: after.validTo, permitted: after.permitted, routeText: after.routeText, conditions: after.conditions,
        conditionsText: after.conditionsText, estimatedFeeCents: after.estimatedFeeCents, actualFeeCents: after.actualFeeCents, refundable: after.refundable,
        ruleVersion: after.ruleVersion, leadTimeDays: after.leadTimeDays, assigneeId: after.assigneeId, notes: after.notes, amendmentReason: after.amendmentReason,
        expiryWarning: after.expiryWarning, version: after.version, updatedAt: now,
      })
      .where('id = :id AND version = :v', { id: before.id, v: before.version })
      .execute();
    return res.affected === 1;
  }

  async insertVersion(m: EntityManager, v: { permitId: string; version: number; status: PermitStatus; snapshot: object; reason: string | null; createdById: string | null }): Promise<void> {
    await m.insert(PermitVersion, v);
  }

  // ---------------------------------------------------------------- people

  /** Active permit clerks and admins, by name. */
  assignees(): Promise<{ id: string; name: string; role: string }[]> {
    return this.ds.query(`SELECT id, name, role FROM users WHERE active AND role IN ('permit_clerk','admin') ORDER BY name ASC`);
  }

  async user(m: EntityManager, id: string): Promise<Assignee | null> {
    const [row] = await m.query(`SELECT id, name, role, active FROM users WHERE id = $1`, [id]);
    return row ?? null;
  }

  // ---------------------------------------------------------------- the move's workflow

  /** The move's issued permits' recorded terms. */
  issuedTerms(moveId: string, manager?: EntityManager): Promise<IssuedTermsRow[]> {
    return preparedQuery<IssuedTermsRow>(
      manager ?? this.ds,
      `SELECT jurisdiction, permit_number, issued_at, conditions FROM permits WHERE move_id = $1 AND status = 'issued' ORDER BY jurisdiction, created_at`,
      [moveId],
    );
  }

  /** The validity windows of the move's issued permits. */
  issuedValidity(m: EntityManager, moveId: string): Promise<{ jurisdiction: string; valid_from: Date; valid_to: Date }[]> {
    return m.query(
      `SELECT jurisdiction, valid_from, valid_to FROM permits WHERE move_id = $1 AND status = 'issued' AND valid_from IS NOT NULL AND valid_to IS NOT NULL`,
      [moveId],
    );
  }

  /** The queue rows of the move's permits that are not void, and whether each was ever paid. */
  liveWithPaid(m: EntityManager, moveId: string): Promise<(PermitRow & { paid_any: boolean })[]> {
    return m.query(
      `SELECT q.*, EXISTS (SELECT 1 FROM permit_payments x WHERE x.permit_id = q.id AND x.status = 'succeeded') AS paid_any
         FROM (${PERMIT_SUMMARY_SQL} WHERE p.move_id = $1 AND p.status <> 'void') q`,
      [moveId],
    );
  }

  issuedConditionsIn(m: EntityManager, moveId: string, codes: string[]): Promise<{ jurisdiction: string; conditions: PermitConditions }[]> {
    return m.query(`SELECT jurisdiction, conditions FROM permits WHERE move_id = $1 AND status = 'issued' AND jurisdiction = ANY($2)`, [moveId, codes]);
  }

  /** The move's permits with each one's latest PDF, in one statement (the driver's run sheet). */
  runSheetRows(manager: EntityManager, moveId: string): Promise<RunSheetPermitRow[]> {
    return preparedQuery<RunSheetPermitRow>(
      manager,
      `SELECT p.id, p.jurisdiction, p.status, p.permit_number AS "permitNumber", p.valid_from AS "validFrom", p.valid_to AS "validTo",
              p.permitted, p.conditions, p.conditions_text AS "conditionsText", p.route_text AS "routeText",
              p.amendment_reason AS "amendmentReason", p.expiry_warning AS "expiryWarning",
              (SELECT d.id FROM permit_documents d WHERE d.permit_id = p.id ORDER BY d.version DESC LIMIT 1) AS "documentId"
         FROM permits p
        WHERE p.move_id = $1 AND p.status <> 'void'
        ORDER BY p.jurisdiction, p.created_at`,
      [moveId],
    );
  }

  // ---------------------------------------------------------------- the expiry scan

  /** One scan at a time across servers: a transaction-scoped advisory lock, false when another holds it. */
  async tryScanLock(m: EntityManager): Promise<boolean> {
    const [{ locked }] = await m.query(`SELECT pg_try_advisory_xact_lock(hashtext('amberline.permits.expiry-scan')) AS locked`);
    return locked;
  }

  /** Issued permits of active moves with a validity end, locked, with their move's departure and travel days. */
  issuedForScan(m: EntityManager): Promise<ScanRow[]> {
    return m.query(
      `SELECT p.id, p.move_id, p.jurisdiction, p.valid_to, p.expiry_warning, to_char(m.requested_departure, 'YYYY-MM-DD') AS departure, m.travel_days
         FROM permits p JOIN moves m ON m.id = p.move_id
        WHERE p.status = 'issued' AND p.valid_to IS NOT NULL AND ${ACTIVE}
        FOR UPDATE OF p`,
    );
  }

  async setExpiryWarning(m: EntityManager, id: string, warning: string | null, now: Date): Promise<void> {
    await m.query(`UPDATE permits SET expiry_warning = $2, expiry_checked_at = $3 WHERE id = $1`, [id, warning, now]);
  }

  /** Who hears of a permit's expiry warning: its assignee (or every active clerk) and the move's dispatcher. */
  async warningRecipients(m: EntityManager, permitId: string): Promise<WarningRecipients> {
    const [row] = await m.query(
      `SELECT p.jurisdiction, p.permit_number, mv.reference, mv.id AS move_id,
              coalesce((SELECT array_agg(u.email) FROM users u WHERE u.id = p.assignee_id AND u.active),
                       (SELECT array_agg(u.email) FROM users u WHERE u.role = 'permit_clerk' AND u.active), '{}') AS clerks,
              (SELECT u.email FROM users u WHERE u.id = mv.created_by AND u.active) AS dispatcher
         FROM permits p JOIN moves mv ON mv.id = p.move_id WHERE p.id = $1`,
      [permitId],
    );
    return row;
  }
}

function withMove(p: Permit): Permit & { moveDriverId: string | null; moveReference: string } {
  return Object.assign(p, { moveDriverId: p.move?.driverId ?? null, moveReference: p.move?.reference ?? '' });
}
