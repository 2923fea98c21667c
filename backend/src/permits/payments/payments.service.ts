import { Inject, Injectable, Logger } from '@nestjs/common';
import { csvCell, DOMAIN_ERRORS, DomainError, type PaymentDto, type PaymentsPage, type SessionUser } from '@amberline/common';
import { AuditService } from '../../audit/audit.service';
import { AppException, fieldError } from '../../core/app-exception';
import { ListPaymentsQuery, PayPermitDto, RefundPermitDto } from '../dto/permit.dto';
import type { PermitPayment } from '../entities/permit-payment.entity';
import type { Permit } from '../entities/permit.entity';
import { PaymentsRepository } from './payments.repository';
import { STRIPE, STRIPE_SETTINGS, type StripeClient, type StripeSettings } from './stripe.provider';

type StripeEvent = ReturnType<StripeClient['webhooks']['constructEvent']>;
type PaymentIntentLike = { id: string; status: string; latest_charge?: string | { id: string } | null; metadata?: Record<string, string>; last_payment_error?: { code?: string; decline_code?: string; message?: string } | null };

const chargeId = (c: PaymentIntentLike['latest_charge']): string | null => (c ? (typeof c === 'string' ? c : c.id) : null);

/** Card errors and the processor's other errors, told apart the way the SDK documents them. */
function isCardError(e: unknown): e is { type: string; code?: string; decline_code?: string; message: string } {
  return !!e && typeof e === 'object' && (e as { type?: string }).type === 'StripeCardError';
}

/**
 * Permit fees through the payment processor's official SDK: one PaymentIntent per attempt, created and confirmed
 * with idempotency keys derived from the permit and the attempt; the signed webhook marks the payment paid.
 */
@Injectable()
export class PaymentsService {
  private readonly logger = new Logger('Payments');
  constructor(
    private readonly repo: PaymentsRepository,
    private readonly audit: AuditService,
    @Inject(STRIPE) private readonly stripe: StripeClient,
    @Inject(STRIPE_SETTINGS) private readonly settings: StripeSettings,
  ) {}

  private dto(p: PermitPayment): Promise<PaymentDto> {
    return this.repo.dto(p.id);
  }

  /**
   * Pays an issued permit's actual fee. The client sends one key per attempt: sending it again returns the same
   * attempt (no second charge). A new attempt is allowed after a decline or failure, never after a payment.
   */
  async pay(permitId: string, dto: PayPermitDto, actor: SessionUser, now: Date): Promise<PaymentDto> {
    // an earlier attempt left pending by a processor that did not answer is settled first (never two charges)
    const stuck = await this.repo.pendingOf(permitId);
    if (stuck && stuck.clientKey !== dto.idempotencyKey) await this.reconcile(stuck, actor, now);
    const row = await this.repo.transaction(async (m) => {
      const permit = await this.repo.lockPermit(m, permitId);
      if (!permit) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No permit ${permitId}`);
      const same = await this.repo.byClientKey(m, permitId, dto.idempotencyKey);
      if (same) {
        if (same.paymentMethod !== dto.paymentMethod) throw fieldError('idempotencyKey', 'was already used for this permit with another payment method; use a new key for a new attempt', 409);
        return { payment: same, replay: true };
      }
      if (permit.status !== 'issued') throw new DomainError(DOMAIN_ERRORS.PERMIT_NOT_ISSUED, `Only an issued permit's fee is paid; this permit is ${permit.status.replace('_', ' ')}`);
      if (permit.actualFeeCents === null || permit.actualFeeCents <= 0) throw fieldError('actualFeeUsd', 'record the actual fee (more than $0) before paying');
      const paid = await this.repo.paidOrPaying(m, permitId);
      if (paid) throw new DomainError(DOMAIN_ERRORS.ALREADY_DONE, `This permit's fee is already ${paid.status === 'succeeded' ? 'paid' : 'being paid'} (attempt ${paid.attempt})`, { paymentId: paid.id });
      const n = await this.repo.nextAttempt(m, permitId);
      const saved = await this.repo.insert(m, {
        permitId, moveId: permit.moveId, attempt: n, clientKey: dto.idempotencyKey, idempotencyKey: `permit-${permitId}-attempt-${n}`,
        amountCents: permit.actualFeeCents, currency: 'usd', status: 'pending', paymentMethod: dto.paymentMethod, createdById: actor.id,
      });
      await this.audit.record(m, {
        moveId: permit.moveId, entity: 'payment', entityId: saved.id, action: 'started', actorId: actor.id,
        after: { permitId, jurisdiction: permit.jurisdiction, attempt: n, amountCents: saved.amountCents, paymentMethod: dto.paymentMethod },
      });
      return { payment: saved, replay: false, permit };
    });
    if (row.replay && row.payment.status !== 'pending') return this.dto(row.payment);
    return this.charge(row.payment, actor, now);
  }

  /** Creates and confirms the PaymentIntent of a pending attempt (again safely: the keys make it one charge). */
  private async charge(payment: PermitPayment, actor: SessionUser, now: Date): Promise<PaymentDto> {
    const permit = await this.repo.permit(payment.permitId);
    let intent: PaymentIntentLike;
    try {
      const created = await this.createIntent(payment, permit);
      await this.repo.setIntent(payment.id, created.id);
      intent = await this.stripe.paymentIntents.confirm(created.id, { payment_method: payment.paymentMethod }, { idempotencyKey: `${payment.idempotencyKey}-confirm` });
    } catch (e) {
      if (isCardError(e)) {
        const message = `${e.message}${e.decline_code ? ` (${e.decline_code.replace(/_/g, ' ')})` : ''}`;
        await this.settle(payment.id, ['pending', 'processing'], { status: 'declined', declineCode: e.decline_code ?? e.code ?? 'card_declined', failureMessage: message }, actor, 'declined', now);
        return this.dto(payment);
      }
      const err = e as { type?: string; message?: string; code?: string };
      if (err.type === 'StripeInvalidRequestError') {
        await this.settle(payment.id, ['pending'], { status: 'failed', failureMessage: err.message ?? 'refused by the payment service' }, actor, 'failed', now);
        throw fieldError(err.code === 'resource_missing' ? 'paymentMethod' : 'payment', `the payment service refused it: ${err.message}`);
      }
      this.logger.warn(`payment ${payment.id}: ${err.type ?? 'error'} ${err.message}`);
      // left pending: sending the same key again retries with the same processor keys (one charge at most)
      throw new AppException(503, 'service_unavailable', 'The payment service did not answer; try again with the same attempt');
    }
    if (intent.status === 'succeeded' || intent.status === 'processing') {
      // paid as far as the processor's answer goes; the signed webhook confirms it (and may already have)
      await this.settle(payment.id, ['pending'], { status: 'processing', stripeChargeId: chargeId(intent.latest_charge) }, actor, 'confirmed', now);
    } else {
      await this.settle(payment.id, ['pending'], { status: 'failed', failureMessage: `payment ended as ${intent.status}` }, actor, 'failed', now);
    }
    return this.dto(payment);
  }

  /** The attempt's PaymentIntent, created once: the same key and the same parameters answer with the same intent. */
  private createIntent(payment: PermitPayment, permit: Permit) {
    return this.stripe.paymentIntents.create(
      {
        amount: payment.amountCents,
        currency: payment.currency,
        automatic_payment_methods: { enabled: true, allow_redirects: 'never' },
        description: `${permit.jurisdiction} permit fee`,
        metadata: { paymentId: payment.id, permitId: permit.id, moveId: permit.moveId, jurisdiction: permit.jurisdiction, attempt: String(payment.attempt) },
      },
      { idempotencyKey: `${payment.idempotencyKey}-create` },
    );
  }

  /**
   * Settles an attempt the processor never answered: its intent is looked up (or created again under the same
   * key, which gives back the one the processor may have made) and then either taken as paid, or canceled so a
   * new attempt can start. While the processor still does not answer, 503 and the attempt stays as it is.
   */
  private async reconcile(p: PermitPayment, actor: SessionUser, now: Date): Promise<void> {
    const permit = await this.repo.permit(p.permitId);
    let intent: PaymentIntentLike | null;
    try {
      if (p.stripePaymentIntentId) intent = await this.stripe.paymentIntents.retrieve(p.stripePaymentIntentId);
      else {
        intent = await this.createIntent(p, permit);
        await this.repo.setIntent(p.id, intent.id);
      }
    } catch (e) {
      const err = e as { type?: string; code?: string; message?: string };
      if (err.type === 'StripeInvalidRequestError' && err.code === 'resource_missing') intent = null;
      else {
        this.logger.warn(`reconciling payment ${p.id}: ${err.type ?? 'error'} ${err.message}`);
        throw new AppException(503, 'service_unavailable', `The payment service still does not answer; attempt ${p.attempt} stays open until it does. Try again shortly`);
      }
    }
    if (!intent) {
      await this.settle(p.id, ['pending'], { status: 'failed', failureMessage: 'the payment service has no record of this attempt' }, actor, 'reconciled', now);
    } else if (intent.status === 'succeeded' || intent.status === 'processing') {
      await this.settle(p.id, ['pending'], { status: 'processing', stripeChargeId: chargeId(intent.latest_charge) }, actor, 'reconciled', now);
    } else if (intent.status === 'canceled') {
      await this.settle(p.id, ['pending'], { status: 'canceled', failureMessage: 'canceled at the payment service' }, actor, 'reconciled', now);
    } else {
      try {
        await this.stripe.paymentIntents.cancel(intent.id, {}, { idempotencyKey: `${p.idempotencyKey}-cancel` });
      } catch (e) {
        const err = e as { type?: string; message?: string };
        this.logger.warn(`canceling payment ${p.id}: ${err.type ?? 'error'} ${err.message}`);
        throw new AppException(503, 'service_unavailable', `The payment service did not confirm canceling attempt ${p.attempt}; try again shortly`);
      }
      await this.settle(p.id, ['pending'], { status: 'canceled', failureMessage: 'not completed: the payment service did not answer; canceled before a new attempt' }, actor, 'reconciled', now);
    }
  }

  /** Moves a payment on from one of `from` statuses (so a late or repeated event changes nothing twice). */
  private async settle(id: string, from: PermitPayment['status'][], set: Partial<PermitPayment>, actor: SessionUser | null, action: string, now: Date): Promise<boolean> {
    return this.repo.transaction(async (m) => {
      const p = await this.repo.lock(m, id);
      if (!p || !from.includes(p.status)) return false;
      await this.repo.update(m, id, { ...set, updatedAt: now });
      await this.audit.record(m, {
        moveId: p.moveId, entity: 'payment', entityId: id, action, actorId: actor?.id ?? null,
        before: { status: p.status }, after: { permitId: p.permitId, ...JSON.parse(JSON.stringify(set)) },
      });
      return true;
    });
  }

  /** The processor's signed events. A signature that does not verify is refused (400) and changes nothing. */
  async webhook(rawBody: Buffer | undefined, signature: string | undefined, now: Date): Promise<{ received: true; handled: boolean }> {
    if (!signature) throw fieldError('stripe-signature', 'the header is missing');
    if (!rawBody?.length) throw fieldError('body', 'the event body is missing');
    let event: StripeEvent;
    try {
      event = this.stripe.webhooks.constructEvent(rawBody, signature, this.settings.webhookSecret);
    } catch (e) {
      throw new AppException(400, 'bad_request', `Webhook signature does not verify: ${(e as Error).message.split('\n')[0]}`);
    }
    const obj = event.data.object as unknown as PaymentIntentLike & { payment_intent?: string; amount?: number; amount_refunded?: number };
    const find = async (): Promise<PermitPayment | null> => {
      const byMeta = obj.metadata?.paymentId;
      if (byMeta && /^[0-9a-f-]{36}$/.test(byMeta)) {
        const p = await this.repo.byId(byMeta);
        if (p) return p;
      }
      const pi = event.type.startsWith('payment_intent.') ? obj.id : obj.payment_intent;
      return pi ? this.repo.byIntent(pi) : null;
    };
    let handled = false;
    switch (event.type) {
      case 'payment_intent.succeeded': {
        const p = await find();
        if (p) {
          handled = await this.settle(p.id, ['pending', 'processing', 'declined', 'failed'], {
            status: 'succeeded', stripePaymentIntentId: obj.id, stripeChargeId: chargeId(obj.latest_charge), succeededAt: now, declineCode: null, failureMessage: null,
          }, null, 'succeeded', now);
        }
        break;
      }
      case 'payment_intent.payment_failed': {
        const p = await find();
        const err = obj.last_payment_error;
        if (p) handled = await this.settle(p.id, ['pending', 'processing'], { status: 'declined', declineCode: err?.decline_code ?? err?.code ?? null, failureMessage: err?.message ?? 'declined' }, null, 'declined', now);
        break;
      }
      case 'payment_intent.canceled': {
        const p = await find();
        if (p) handled = await this.settle(p.id, ['pending', 'processing'], { status: 'canceled' }, null, 'canceled', now);
        break;
      }
      case 'charge.refunded': {
        const p = await find();
        if (p && (obj.amount_refunded ?? 0) >= (obj.amount ?? Infinity)) {
          handled = await this.settle(p.id, ['succeeded'], { status: 'refunded', refundedAt: now }, null, 'refunded', now);
        }
        break;
      }
      default:
        break;
    }
    return { received: true, handled };
  }

  /** Refunds the paid fee of a void permit, when the rule it was created under says fees are refundable. */
  async refund(permitId: string, dto: RefundPermitDto, actor: SessionUser, now: Date): Promise<PaymentDto> {
    const { payment, permit } = await this.repo.transaction(async (m) => {
      const permit = await this.repo.lockPermit(m, permitId);
      if (!permit) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No permit ${permitId}`);
      if (permit.status !== 'void') throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, 'Only a void permit\'s fee can be refunded; void the permit first');
      if (permit.refundable !== true) {
        throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, permit.refundable === false
          ? `${permit.jurisdiction} permit fees are not refundable under its rule (rule version ${permit.ruleVersion ?? '?'})`
          : `The ${permit.jurisdiction} rule does not say its permit fees are refundable`);
      }
      const payment = await this.repo.lockSucceeded(m, permitId);
      if (!payment) throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, 'Nothing was paid for this permit, so there is nothing to refund');
      if (!payment.stripePaymentIntentId) throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, 'This payment has no processor reference to refund');
      return { payment, permit };
    });
    let refund: { id: string; status: string | null };
    try {
      refund = await this.stripe.refunds.create(
        { payment_intent: payment.stripePaymentIntentId!, reason: 'requested_by_customer', metadata: { paymentId: payment.id, permitId } },
        { idempotencyKey: `refund-${payment.id}` },
      );
    } catch (e) {
      const err = e as { type?: string; message?: string };
      if (err.type === 'StripeInvalidRequestError') throw new DomainError(DOMAIN_ERRORS.PROCESSOR_REFUSED, `The payment service refused the refund: ${err.message}`);
      throw new AppException(503, 'service_unavailable', 'The payment service did not answer; try the refund again');
    }
    if (refund.status !== 'succeeded' && refund.status !== 'pending') throw new DomainError(DOMAIN_ERRORS.PROCESSOR_REFUSED, `The refund ended as ${refund.status}`);
    await this.repo.transaction(async (m) => {
      await this.repo.markRefunded(m, payment.id, refund.id, now);
      await this.audit.record(m, {
        moveId: permit.moveId, entity: 'payment', entityId: payment.id, action: 'refunded', actorId: actor.id,
        before: { status: 'succeeded' }, after: { permitId, jurisdiction: permit.jurisdiction, stripeRefundId: refund.id, amountCents: payment.amountCents }, reason: dto.reason,
      });
    });
    return this.dto(payment);
  }

  /** The ledger: every attempt, newest first, per move or overall, with the paid and refunded totals. */
  async ledger(q: ListPaymentsQuery, viewer: SessionUser): Promise<PaymentsPage> {
    if (q.moveId && viewer.role === 'driver') throw new AppException(403, 'forbidden', 'Your role may not do this');
    if (q.moveId && !(await this.repo.moveExists(q.moveId))) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No move ${q.moveId}`);
    const { items, total } = await this.repo.ledgerPage(q, q.page, q.pageSize);
    const t = await this.repo.totals(q);
    return { items, total, page: q.page, pageSize: q.pageSize, totals: { succeededUsd: t.paidCents / 100, refundedUsd: t.refundedCents / 100 } };
  }

  /** The ledger as CSV (at most 10,000 rows), one line per attempt. */
  async ledgerCsv(q: ListPaymentsQuery): Promise<string> {
    const rows = await this.repo.ledgerLines(q, 10_000);
    const head = ['date', 'move', 'jurisdiction', 'permit_number', 'attempt', 'amount_usd', 'currency', 'status', 'payment_method', 'payment_intent', 'charge', 'refund', 'decline_code', 'paid_at', 'refunded_at'];
    const lines = rows.map((r) =>
      [r.createdAt, r.moveReference, r.jurisdiction, r.permitNumber, r.attempt, r.amountUsd.toFixed(2), r.currency, r.status, r.paymentMethod,
        r.stripePaymentIntentId, r.stripeChargeId, r.stripeRefundId, r.declineCode, r.succeededAt, r.refundedAt].map(csvCell).join(','),
    );
    return `${[head.join(','), ...lines].join('\r\n')}\r\n`;
  }
}
