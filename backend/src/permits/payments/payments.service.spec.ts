import { DOMAIN_ERRORS, DomainError, type SessionUser } from '@amberline/common';
import type { EntityManager } from 'typeorm';
import type { AuditService } from '../../audit/audit.service';
import type { PermitPayment } from '../entities/permit-payment.entity';
import type { Permit } from '../entities/permit.entity';
import type { PaymentsRepository } from './payments.repository';
import { PaymentsService } from './payments.service';
import type { StripeClient, StripeSettings } from './stripe.provider';
import { refusal } from '../../../test/utils/refusal';

const clerk: SessionUser = { id: '00000000-0000-4000-8000-000000000001', email: 'clerk@example.test', name: 'Clerk', role: 'permit_clerk' };
const now = new Date('2026-12-01T15:00:00Z');
const settings: StripeSettings = { secretKey: 'sk_test_x', host: '127.0.0.1', port: 1, protocol: 'http', webhookSecret: 'whsec_x' };

const permit = (over: Partial<Permit> = {}) => ({ id: 'p1', moveId: 'm1', jurisdiction: 'TX', status: 'issued', actualFeeCents: 6000, refundable: true, ruleVersion: 2, ...over }) as Permit;
const payment = (over: Partial<PermitPayment> = {}) => ({ id: 'x1', permitId: 'p1', attempt: 1, status: 'succeeded', stripePaymentIntentId: 'pi_1', amountCents: 6000, ...over }) as PermitPayment;

function setup(p: Permit | null, paid: PermitPayment | null = null, stripe: Partial<StripeClient> = {}) {
  const inserted: Partial<PermitPayment>[] = [];
  const repo = {
    transaction: (fn: (m: EntityManager) => Promise<unknown>) => fn({} as EntityManager),
    pendingOf: async () => null,
    lockPermit: async () => p,
    byClientKey: async () => null,
    paidOrPaying: async () => paid,
    lockSucceeded: async () => paid,
    nextAttempt: async () => 2,
    insert: async (_m: EntityManager, x: Partial<PermitPayment>) => {
      inserted.push(x);
      return x;
    },
  } as unknown as PaymentsRepository;
  const audit = { record: async () => undefined } as unknown as AuditService;
  return { s: new PaymentsService(repo, audit, stripe as StripeClient, settings), inserted };
}

describe('PaymentsService.pay', () => {
  it.each([['to_file'], ['filed'], ['needs_amendment'], ['void']])('pays only an issued permit: %s is refused', async (status) => {
    const { s, inserted } = setup(permit({ status: status as Permit['status'] }));
    const e = await refusal(s.pay('p1', { paymentMethod: 'pm_card_visa', idempotencyKey: 'key-12345' }, clerk, now));
    expect(e).toBeInstanceOf(DomainError);
    expect(e.code).toBe(DOMAIN_ERRORS.PERMIT_NOT_ISSUED);
    expect(inserted).toHaveLength(0);
  });

  it('refuses a second payment of a paid fee, naming the attempt', async () => {
    const { s } = setup(permit(), payment());
    const e = await refusal(s.pay('p1', { paymentMethod: 'pm_card_visa', idempotencyKey: 'key-12345' }, clerk, now));
    expect(e.code).toBe(DOMAIN_ERRORS.ALREADY_DONE);
    expect(e.message).toMatch(/already paid \(attempt 1\)/);
    expect(e.details).toEqual({ paymentId: 'x1' });
  });

  it('a permit that does not exist is not found', async () => {
    const { s } = setup(null);
    expect((await refusal(s.pay('p1', { paymentMethod: 'pm_card_visa', idempotencyKey: 'key-12345' }, clerk, now))).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
});

describe('PaymentsService.refund', () => {
  it('refunds only a void permit', async () => {
    const { s } = setup(permit({ status: 'issued' }), payment());
    const e = await refusal(s.refund('p1', { reason: 'move cancelled' }, clerk, now));
    expect(e.code).toBe(DOMAIN_ERRORS.PRECONDITION_UNMET);
    expect(e.message).toMatch(/void the permit first/);
  });

  it('refunds nothing when nothing was paid', async () => {
    const { s } = setup(permit({ status: 'void' }), null);
    expect((await refusal(s.refund('p1', { reason: 'x' }, clerk, now))).code).toBe(DOMAIN_ERRORS.PRECONDITION_UNMET);
  });

  it('refunds nothing when the rule says fees are not refundable', async () => {
    const { s } = setup(permit({ status: 'void', refundable: false }), payment());
    const e = await refusal(s.refund('p1', { reason: 'x' }, clerk, now));
    expect(e.code).toBe(DOMAIN_ERRORS.PRECONDITION_UNMET);
    expect(e.message).toMatch(/not refundable under its rule \(rule version 2\)/);
  });

  it('passes on the processor refusing the refund', async () => {
    const stripe = { refunds: { create: async () => Promise.reject(Object.assign(new Error('charge already refunded'), { type: 'StripeInvalidRequestError' })) } };
    const { s } = setup(permit({ status: 'void' }), payment(), stripe as unknown as Partial<StripeClient>);
    const e = await refusal(s.refund('p1', { reason: 'x' }, clerk, now));
    expect(e.code).toBe(DOMAIN_ERRORS.PROCESSOR_REFUSED);
    expect(e.message).toBe('The payment service refused the refund: charge already refunded');
  });

  it('a refund the processor ends as failed is refused', async () => {
    const stripe = { refunds: { create: async () => ({ id: 're_1', status: 'failed' }) } };
    const { s } = setup(permit({ status: 'void' }), payment(), stripe as unknown as Partial<StripeClient>);
    expect((await refusal(s.refund('p1', { reason: 'x' }, clerk, now))).code).toBe(DOMAIN_ERRORS.PROCESSOR_REFUSED);
  });
});
