import { Injectable } from '@nestjs/common';
import { DataSource, EntityManager, In } from 'typeorm';
import type { PaymentDto, PaymentStatus } from '@amberline/common';
import { PermitPayment } from '../entities/permit-payment.entity';
import { Permit } from '../entities/permit.entity';
import { toPaymentDto } from '../permit-mappers';

export type LedgerFilter = { moveId?: string; status?: PaymentStatus; jurisdiction?: string };

/** Fee payments' rows: attempts, their settling, the ledger and its totals. */
@Injectable()
export class PaymentsRepository {
  constructor(private readonly ds: DataSource) {}

  transaction<T>(fn: (m: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  private m(manager?: EntityManager): EntityManager {
    return manager ?? this.ds.manager;
  }

  /** The attempt as the desk shows it, with its permit's move reference and number. */
  async dto(id: string, manager?: EntityManager): Promise<PaymentDto> {
    const full = await this.m(manager).findOneOrFail(PermitPayment, { where: { id }, relations: { permit: { move: true }, createdBy: true } });
    return ledgerDto(full);
  }

  pendingOf(permitId: string): Promise<PermitPayment | null> {
    return this.ds.manager.findOne(PermitPayment, { where: { permitId, status: 'pending' } });
  }

  permit(id: string): Promise<Permit> {
    return this.ds.manager.findOneByOrFail(Permit, { id });
  }

  lockPermit(m: EntityManager, id: string): Promise<Permit | null> {
    return m.findOne(Permit, { where: { id }, lock: { mode: 'pessimistic_write' } });
  }

  byClientKey(m: EntityManager, permitId: string, clientKey: string): Promise<PermitPayment | null> {
    return m.findOneBy(PermitPayment, { permitId, clientKey });
  }

  /** An attempt that is paid or still being paid. */
  paidOrPaying(m: EntityManager, permitId: string): Promise<PermitPayment | null> {
    return m.findOne(PermitPayment, { where: { permitId, status: In(['succeeded', 'processing', 'pending']) } });
  }

  lockSucceeded(m: EntityManager, permitId: string): Promise<PermitPayment | null> {
    return m.findOne(PermitPayment, { where: { permitId, status: 'succeeded' }, lock: { mode: 'pessimistic_write' } });
  }

  async nextAttempt(m: EntityManager, permitId: string): Promise<number> {
    const [{ n }] = await m.query(`SELECT COALESCE(max(attempt), 0)::int + 1 AS n FROM permit_payments WHERE permit_id = $1`, [permitId]);
    return n;
  }

  insert(m: EntityManager, p: Partial<PermitPayment>): Promise<PermitPayment> {
    return m.save(m.create(PermitPayment, p));
  }

  async setIntent(id: string, stripePaymentIntentId: string): Promise<void> {
    await this.ds.manager.update(PermitPayment, { id }, { stripePaymentIntentId });
  }

  lock(m: EntityManager, id: string): Promise<PermitPayment | null> {
    return m.findOne(PermitPayment, { where: { id }, lock: { mode: 'pessimistic_write' } });
  }

  async update(m: EntityManager, id: string, set: Partial<PermitPayment>): Promise<void> {
    await m.update(PermitPayment, { id }, set);
  }

  /** Marks a succeeded attempt refunded (nothing when it is no longer succeeded). */
  async markRefunded(m: EntityManager, id: string, stripeRefundId: string, now: Date): Promise<void> {
    await m.update(PermitPayment, { id, status: 'succeeded' }, { status: 'refunded', stripeRefundId, refundedAt: now, updatedAt: now });
  }

  byId(id: string): Promise<PermitPayment | null> {
    return this.ds.manager.findOneBy(PermitPayment, { id });
  }

  byIntent(stripePaymentIntentId: string): Promise<PermitPayment | null> {
    return this.ds.manager.findOneBy(PermitPayment, { stripePaymentIntentId });
  }

  async moveExists(moveId: string): Promise<boolean> {
    const [{ found }] = await this.ds.query(`SELECT EXISTS (SELECT 1 FROM moves WHERE id = $1) AS found`, [moveId]);
    return found;
  }

  private ledgerQuery(q: LedgerFilter) {
    const qb = this.ds.manager
      .createQueryBuilder(PermitPayment, 'x')
      .innerJoinAndSelect('x.permit', 'p')
      .innerJoinAndSelect('p.move', 'm')
      .leftJoinAndSelect('x.createdBy', 'u');
    if (q.moveId) qb.andWhere('x.move_id = :moveId', { moveId: q.moveId });
    if (q.status) qb.andWhere('x.status = :status', { status: q.status });
    if (q.jurisdiction) qb.andWhere('p.jurisdiction = :j', { j: q.jurisdiction });
    return qb.orderBy('x.created_at', 'DESC').addOrderBy('x.id', 'ASC');
  }

  /** One page of the ledger, newest first, and the count of all that match. */
  async ledgerPage(q: LedgerFilter, page: number, pageSize: number): Promise<{ items: PaymentDto[]; total: number }> {
    const [rows, total] = await this.ledgerQuery(q).skip((page - 1) * pageSize).take(pageSize).getManyAndCount();
    return { items: rows.map(ledgerDto), total };
  }

  /** At most `limit` ledger lines, newest first. */
  async ledgerLines(q: LedgerFilter, limit: number): Promise<PaymentDto[]> {
    return (await this.ledgerQuery(q).take(limit).getMany()).map(ledgerDto);
  }

  /** Paid and refunded totals in cents, per move or jurisdiction or overall (whatever the status filter). */
  async totals(q: Pick<LedgerFilter, 'moveId' | 'jurisdiction'>): Promise<{ paidCents: number; refundedCents: number }> {
    const params: unknown[] = [];
    const where: string[] = [];
    if (q.moveId) where.push(`x.move_id = $${params.push(q.moveId)}`);
    if (q.jurisdiction) where.push(`p.jurisdiction = $${params.push(q.jurisdiction)}`);
    const [t] = await this.ds.query(
      `SELECT COALESCE(sum(x.amount_cents) FILTER (WHERE x.status = 'succeeded'), 0)::bigint AS paid,
              COALESCE(sum(x.amount_cents) FILTER (WHERE x.status = 'refunded'), 0)::bigint AS refunded
         FROM permit_payments x JOIN permits p ON p.id = x.permit_id ${where.length ? `WHERE ${where.join(' AND ')}` : ''}`,
      params,
    );
    return { paidCents: Number(t.paid), refundedCents: Number(t.refunded) };
  }
}

const ledgerDto = (x: PermitPayment): PaymentDto =>
  toPaymentDto(x, { moveReference: x.permit?.move?.reference ?? '', jurisdiction: x.permit?.jurisdiction ?? '', permitNumber: x.permit?.permitNumber ?? null });
