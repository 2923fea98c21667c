import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Stripe from 'stripe';
import type { MoveDto, PaymentDto, PermitDto, Role } from '@amberline/common';
import { seedTractor, seedTrailer } from '@amberline/seed';
import { daysFromNow, texasMove } from './fixtures/moves';
import { makePdf, validity } from './fixtures/permits';
import { createTestApp, type TestApp } from './utils/create-test-app';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const { startStripeFake } = require('../scripts/stripe-fake.js');

type FakeEvent = { event: { id: string; type: string; data: { object: { id: string; metadata?: Record<string, string>; payment_intent?: string } } }; payload: string; header: string };
type Fake = { port: number; close: () => Promise<void>; state: { paymentIntents: Map<string, { status: string; amount: number }>; requests: { path: string; idempotencyKey: string | null }[] } };

/**
 * Fee payments through the official SDK against the local fake (started here, on a free port). The fake signs
 * its events with the SDK's helper; the test hands each one to the webhook route as the fake would.
 */
describe('permit fee payments', () => {
  let t: TestApp;
  let fake: Fake;
  let store: string;
  const events: FakeEvent[] = [];
  const tokens = {} as Record<Role, string>;
  let tractorId: string;
  let trailerId: string;
  const SECRET = 'whsec_payments_spec_secret';

  beforeAll(async () => {
    fake = await startStripeFake({ port: 0, webhookUrl: null, apiKey: 'sk_test_payments_spec', webhookSecret: SECRET, onEvent: (event: FakeEvent['event'], payload: string, header: string) => events.push({ event, payload, header }) });
    Object.assign(process.env, {
      STRIPE_API_HOST: '127.0.0.1', STRIPE_API_PORT: String(fake.port), STRIPE_API_PROTOCOL: 'http', STRIPE_SECRET_KEY: 'sk_test_payments_spec', STRIPE_WEBHOOK_SECRET: SECRET,
    });
    store = mkdtempSync(join(tmpdir(), 'amberline-pay-files-'));
    process.env.FILE_STORE_DIR = store;
    t = await createTestApp();
    for (const [role, u] of Object.entries(await t.signedInAll())) tokens[role as Role] = u.token;
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(async () => {
    await t.close();
    await fake.close();
    rmSync(store, { recursive: true, force: true });
  });
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });
  const key = () => `k${Date.now()}${Math.random().toString(36).slice(2, 10)}`;

  const newMove = async (over = {}): Promise<MoveDto> => (await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, over))).body;
  const permitOf = async (move: MoveDto, code = 'TX'): Promise<PermitDto> => {
    await t.http().post(`/api/moves/${move.id}/permits/sync`).set(as('permit_clerk'));
    return (await t.http().get(`/api/moves/${move.id}/permits`).set(as('permit_clerk'))).body.find((p: PermitDto) => p.jurisdiction === code);
  };
  const patch = async (p: { id: string; version: number }, body: object) => {
    const res = await t.http().patch(`/api/permits/${p.id}`).set(as('permit_clerk')).send({ version: p.version, ...body });
    expect(res.status).toBe(200);
    return res.body as PermitDto;
  };
  const issued = async (move: MoveDto, fee: number | null = 210, code = 'TX'): Promise<PermitDto> => {
    const p = await permitOf(move, code);
    const filed = await patch(p, { status: 'filed' });
    return patch(filed, { status: 'issued', permitNumber: `${code}-${Date.now()}`, ...validity(10, 5), ...(fee !== null ? { actualFeeUsd: fee } : {}) });
  };
  const pay = (permitId: string, paymentMethod = 'pm_card_visa', idempotencyKey = key(), role: Role = 'permit_clerk') =>
    t.http().post(`/api/permits/${permitId}/payments`).set(as(role)).send({ paymentMethod, idempotencyKey });
  /** Hands the fake's signed events for a PaymentIntent to the webhook route, as the fake does for a running server. */
  const deliver = async (type: string, pi: string) => {
    const e = events.find((x) => x.event.type === type && (x.event.data.object.id === pi || x.event.data.object.payment_intent === pi));
    expect(e).toBeDefined();
    return t.http().post('/api/payments/webhook').set('stripe-signature', e!.header).set('content-type', 'application/json').send(e!.payload);
  };
  const payment = async (x: PaymentDto): Promise<PaymentDto> => {
    const list = (await t.http().get('/api/payments').query({ moveId: x.moveId }).set(as('permit_clerk'))).body.items as PaymentDto[];
    return list.find((y) => y.id === x.id)!;
  };

  it('pays the actual fee in cents with a test card; the signed webhook marks it paid', async () => {
    const move = await newMove();
    const p = await issued(move, 210.55);
    const res = await pay(p.id);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'processing', amountCents: 21055, amountUsd: 210.55, currency: 'usd', attempt: 1, jurisdiction: 'TX', moveReference: move.reference });
    const pi = res.body.stripePaymentIntentId as string;
    expect(pi).toMatch(/^pi_/);
    expect(fake.state.paymentIntents.get(pi)).toMatchObject({ status: 'succeeded', amount: 21055 });
    // idempotency keys per permit and attempt reached the processor
    const keys = fake.state.requests.filter((r) => r.path.includes(pi) || r.path === '/v1/payment_intents').map((r) => r.idempotencyKey);
    expect(keys).toEqual(expect.arrayContaining([`permit-${p.id}-attempt-1-create`, `permit-${p.id}-attempt-1-confirm`]));

    const hook = await deliver('payment_intent.succeeded', pi);
    expect(hook.status).toBe(200);
    expect(hook.body).toEqual({ received: true, handled: true });
    const paid = await payment(res.body);
    expect(paid).toMatchObject({ status: 'succeeded', stripeChargeId: expect.stringMatching(/^ch_/) });
    expect(paid.succeededAt).toBeTruthy();
    const detail: PermitDto = (await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body;
    expect(detail).toMatchObject({ paid: true, paymentStatus: 'succeeded' });
    // the same event again changes nothing
    expect((await deliver('payment_intent.succeeded', pi)).body).toEqual({ received: true, handled: false });
    // paying again with a new key is refused: already paid
    const twice = await pay(p.id);
    expect(twice.status).toBe(409);
    expect(twice.body.message).toMatch(/already paid/);
  });

  it('a declined card is recorded and said plainly; a new attempt with a good card then succeeds', async () => {
    const move = await newMove();
    const p = await issued(move);
    const res = await pay(p.id, 'pm_card_chargeDeclinedInsufficientFunds');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'declined', declineCode: 'insufficient_funds', failureMessage: 'Your card has insufficient funds. (insufficient funds)' });
    const retry = await pay(p.id, 'pm_card_visa');
    expect(retry.status).toBe(201);
    expect(retry.body).toMatchObject({ status: 'processing', attempt: 2 });
    const ledger = (await t.http().get('/api/payments').query({ moveId: move.id }).set(as('permit_clerk'))).body;
    expect(ledger.items.map((x: PaymentDto) => [x.attempt, x.status])).toEqual([[2, 'processing'], [1, 'declined']]);
  });

  it('paying twice with the same key makes one charge', async () => {
    const move = await newMove();
    const p = await issued(move);
    const k = key();
    const [a, b] = await Promise.all([pay(p.id, 'pm_card_visa', k), pay(p.id, 'pm_card_visa', k)]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.id).toBe(b.body.id);
    const c = await pay(p.id, 'pm_card_visa', k);
    expect(c.body.id).toBe(a.body.id);
    const charges = [...fake.state.paymentIntents.values()].filter((x) => (x as unknown as { metadata: { permitId: string } }).metadata.permitId === p.id);
    expect(charges).toHaveLength(1);
    const rows = await t.ds.query(`SELECT count(*)::int AS n FROM permit_payments WHERE permit_id = $1`, [p.id]);
    expect(rows[0].n).toBe(1);
  });

  it('a processor that stops answering leaves the attempt open (503); once it is back, a new attempt settles the old one first and charges once', async () => {
    const move = await newMove();
    const p = await issued(move);
    const port = fake.port;
    const restart = async () => {
      fake = await startStripeFake({ port, webhookUrl: null, apiKey: 'sk_test_payments_spec', webhookSecret: SECRET, onEvent: (event: FakeEvent['event'], payload: string, header: string) => events.push({ event, payload, header }) });
    };
    await fake.close(); // the processor is down
    const down = await pay(p.id);
    expect(down.status).toBe(503);
    const stuck = await t.ds.query(`SELECT id, status, attempt FROM permit_payments WHERE permit_id = $1`, [p.id]);
    expect(stuck).toEqual([expect.objectContaining({ status: 'pending', attempt: 1 })]);
    // still down: a new attempt cannot settle the open one, and says so (no second attempt is started)
    const stillDown = await pay(p.id);
    expect(stillDown.status).toBe(503);
    expect(stillDown.body.message).toMatch(/attempt 1 stays open/);
    await restart(); // back up, with no memory of the earlier calls
    const again = await pay(p.id);
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ attempt: 2, status: 'processing' });
    const rows: { attempt: number; status: string }[] = await t.ds.query(`SELECT attempt, status FROM permit_payments WHERE permit_id = $1 ORDER BY attempt`, [p.id]);
    expect(rows).toEqual([{ attempt: 1, status: 'canceled' }, { attempt: 2, status: 'processing' }]);
    // at the processor: the first attempt's intent canceled, one charge
    const intents = [...fake.state.paymentIntents.values()].filter((x) => (x as unknown as { metadata: { permitId: string } }).metadata.permitId === p.id);
    expect(intents.map((x) => x.status).sort()).toEqual(['canceled', 'succeeded']);
  });

  it('refuses to pay a permit not issued (409), without an actual fee (400), or with a bad request (400)', async () => {
    const move = await newMove();
    const p = await permitOf(move);
    const notIssued = await pay(p.id);
    expect(notIssued.status).toBe(409);
    expect(notIssued.body.message).toMatch(/Only an issued permit/);
    const noFee = await issued(await newMove(), null);
    const zero = await pay(noFee.id);
    expect(zero.status).toBe(400);
    expect(zero.body.details[0]).toEqual({ field: 'actualFeeUsd', reason: expect.stringMatching(/more than \$0/) });
    const bad = await t.http().post(`/api/permits/${noFee.id}/payments`).set(as('permit_clerk')).send({ paymentMethod: 'visa', idempotencyKey: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.message).toMatch(/paymentMethod/);
    expect(bad.body.message).toMatch(/idempotencyKey/);
    const unknownCard = await issued(await newMove());
    const uc = await pay(unknownCard.id, 'pm_card_nonexistent');
    expect(uc.status).toBe(400);
    expect(uc.body.details[0].field).toBe('paymentMethod');
    expect((await t.http().get(`/api/permits/${noFee.id}`).set(as('permit_clerk'))).body.payments).toEqual([]);
    expect((await pay(unknownCard.id, 'pm_card_visa', key(), 'dispatcher')).status).toBe(403);
  });

  it('a webhook with a bad signature gets 400 and changes nothing', async () => {
    const move = await newMove();
    const p = await issued(move);
    const res = await pay(p.id);
    const pi = res.body.stripePaymentIntentId as string;
    const e = events.find((x) => x.event.type === 'payment_intent.succeeded' && x.event.data.object.id === pi)!;
    const forged = Stripe.webhooks.generateTestHeaderString({ payload: e.payload, secret: 'whsec_someone_else' });
    const bad = await t.http().post('/api/payments/webhook').set('stripe-signature', forged).set('content-type', 'application/json').send(e.payload);
    expect(bad.status).toBe(400);
    expect(bad.body.message).toMatch(/signature/i);
    const tampered = await t.http().post('/api/payments/webhook').set('stripe-signature', e.header).set('content-type', 'application/json').send(e.payload.replace('"usd"', '"eur"'));
    expect(tampered.status).toBe(400);
    const unsigned = await t.http().post('/api/payments/webhook').set('content-type', 'application/json').send(e.payload);
    expect(unsigned.status).toBe(400);
    expect((await payment(res.body)).status).toBe('processing');
  });

  it('refunds a void permit whose rule says fees are refundable, and refuses where the rule says not', async () => {
    // New Mexico's rule made refundable for this test (a new rulebook version)
    const cur = (await t.http().get('/api/rulebook/jurisdictions/NM').set(as('admin'))).body;
    if (cur.record.fee.value?.refundable !== true) {
      const fee = { status: 'sourced', value: { baseUsd: 25, refundable: true }, citation: 'test: fee refundable when voided', url: 'https://example.org/test', edition: 'test', asOf: '2026-12-02' };
      const put = await t.http().put('/api/rulebook/jurisdictions/NM').set(as('admin')).send({ record: { ...cur.record, fee }, note: 'fees refundable when voided (test)' });
      expect(put.status).toBe(200);
    }
    const move = await newMove({
      route: [{ order: 1, jurisdiction: 'NM', roads: 'I-25 N', miles: 80, roadType: 'interstate', zip: '87102' }],
      origin: 'Albuquerque, NM', destination: 'Santa Fe, NM',
    });
    const p = await issued(move, 120, 'NM');
    expect(p.refundable).toBe(true);
    const res = await pay(p.id);
    await deliver('payment_intent.succeeded', res.body.stripePaymentIntentId);
    const notVoid = await t.http().post(`/api/permits/${p.id}/refunds`).set(as('permit_clerk')).send({ reason: 'trip cancelled' });
    expect(notVoid.status).toBe(409);
    const cur2: PermitDto = (await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body;
    await patch(cur2, { status: 'void', reason: 'customer cancelled the trip' });
    const refund = await t.http().post(`/api/permits/${p.id}/refunds`).set(as('permit_clerk')).send({ reason: 'trip cancelled' });
    expect(refund.status).toBe(201);
    expect(refund.body).toMatchObject({ status: 'refunded', stripeRefundId: expect.stringMatching(/^re_/) });
    expect(await deliver('charge.refunded', res.body.stripePaymentIntentId)).toMatchObject({ status: 200 });
    const again = await t.http().post(`/api/permits/${p.id}/refunds`).set(as('permit_clerk')).send({ reason: 'again' });
    expect(again.status).toBe(409);

    // Texas: the fee on file names no refund, so none is made ("not on file" is never "refundable")
    const tx = await issued(await newMove());
    await pay(tx.id);
    const txNow: PermitDto = (await t.http().get(`/api/permits/${tx.id}`).set(as('permit_clerk'))).body;
    await patch(txNow, { status: 'void', reason: 'not needed' });
    const refused = await t.http().post(`/api/permits/${tx.id}/refunds`).set(as('permit_clerk')).send({ reason: 'try' });
    expect(refused.status).toBe(409);
    expect(refused.body.message).toMatch(/TX (permit fees are not refundable|rule does not say its permit fees are refundable)/);
  });

  it('the ledger per move and overall, with totals and a CSV export', async () => {
    const move = await newMove({ customer: 'Ledger Row Quarry' });
    const p = await issued(move, 99.5);
    const res = await pay(p.id);
    await deliver('payment_intent.succeeded', res.body.stripePaymentIntentId);
    const ledger = await t.http().get('/api/payments').query({ moveId: move.id }).set(as('dispatcher'));
    expect(ledger.status).toBe(200);
    expect(ledger.body).toMatchObject({ total: 1, totals: { succeededUsd: 99.5, refundedUsd: 0 } });
    expect(ledger.body.items[0]).toMatchObject({ permitNumber: p.permitNumber, jurisdiction: 'TX', amountUsd: 99.5, status: 'succeeded' });
    const overall = await t.http().get('/api/payments').query({ status: 'succeeded', pageSize: 5 }).set(as('admin'));
    expect(overall.body.total).toBeGreaterThanOrEqual(1);
    expect(overall.body.items.length).toBeLessThanOrEqual(5);
    const csv = await t.http().get('/api/payments/export.csv').query({ moveId: move.id }).set(as('permit_clerk'));
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/attachment; filename="payments-\d{4}-\d{2}-\d{2}\.csv"/);
    const lines = csv.text.trim().split('\r\n');
    expect(lines[0]).toBe('date,move,jurisdiction,permit_number,attempt,amount_usd,currency,status,payment_method,payment_intent,charge,refund,decline_code,paid_at,refunded_at');
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain(`${move.reference},TX,${p.permitNumber},1,99.50,usd,succeeded,pm_card_visa,${res.body.stripePaymentIntentId}`);
    expect((await t.http().get('/api/payments').set(as('driver'))).status).toBe(403);
    expect((await t.http().get('/api/payments').query({ moveId: 'nope' }).set(as('admin'))).status).toBe(400);
  });

  it('the move advances to permits received once its permit is issued, with its PDF, paid and valid over the travel days', async () => {
    const move = await newMove({ requestedDeparture: daysFromNow(10), travelDays: 2 });
    const p = await issued(move);
    const stage = () => t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'permits_received' });
    const first = await stage();
    expect(first.status).toBe(409);
    expect(first.body.details.unmet.map((u: { code: string }) => u.code).sort()).toEqual(['permit_pdf_missing', 'permit_unpaid']);
    const up = await t.http().post(`/api/permits/${p.id}/documents`).set(as('permit_clerk')).attach('file', await makePdf('guard'), { filename: 'tx.pdf', contentType: 'application/pdf' });
    expect(up.status).toBe(201);
    const res = await pay(p.id);
    const waiting = await stage();
    expect(waiting.status).toBe(409);
    expect(waiting.body.details.unmet).toEqual([expect.objectContaining({ code: 'permit_unpaid', jurisdiction: 'TX', message: 'TX permit: fee payment not confirmed yet' })]);
    await deliver('payment_intent.succeeded', res.body.stripePaymentIntentId);
    const ok = await stage();
    expect(ok.status).toBe(201);
    expect(ok.body.stage).toBe('permits_received');
  });
});
