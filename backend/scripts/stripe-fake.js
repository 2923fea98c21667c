#!/usr/bin/env node
/* eslint-disable @typescript-eslint/no-require-imports */
'use strict';
/**
 * A small local stand-in for the payment processor's HTTP API, enough for the official `stripe` SDK:
 * PaymentIntents create / retrieve / confirm / cancel, refunds, idempotency keys, card errors (402) for the
 * documented test payment methods, and signed webhook events posted to a configurable URL.
 * State lives in memory. Loopback only.
 *
 *   node backend/scripts/stripe-fake.js        (env: STRIPE_API_PORT, STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET,
 *                                                STRIPE_WEBHOOK_URL — the URL events are posted to; none = not posted)
 *   require('./stripe-fake').startStripeFake({ port: 0, onEvent }) in tests.
 */
const http = require('node:http');
const crypto = require('node:crypto');
const Stripe = require('stripe');

/** Test payment methods that succeed. */
const GOOD_METHODS = new Set(['pm_card_visa', 'pm_card_visa_debit', 'pm_card_mastercard', 'pm_card_amex', 'pm_card_discover', 'pm_card_us']);
/** Test payment methods that are declined, with the error the processor documents for each. */
const DECLINES = {
  pm_card_chargeDeclined: { code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' },
  pm_card_chargeDeclinedInsufficientFunds: { code: 'card_declined', decline_code: 'insufficient_funds', message: 'Your card has insufficient funds.' },
  pm_card_chargeDeclinedLostCard: { code: 'card_declined', decline_code: 'lost_card', message: 'Your card was declined.' },
  pm_card_chargeDeclinedStolenCard: { code: 'card_declined', decline_code: 'stolen_card', message: 'Your card was declined.' },
  pm_card_chargeDeclinedExpiredCard: { code: 'expired_card', decline_code: 'expired_card', message: 'Your card has expired.' },
  pm_card_chargeDeclinedIncorrectCvc: { code: 'incorrect_cvc', decline_code: 'incorrect_cvc', message: "Your card's security code is incorrect." },
  pm_card_chargeDeclinedProcessingError: { code: 'processing_error', decline_code: 'processing_error', message: 'An error occurred while processing your card. Try again in a little bit.' },
};

const rid = (prefix) => `${prefix}_${crypto.randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;
const nowSec = () => Math.floor(Date.now() / 1000);

/** `a[b][c]=1&list[0]=x` → `{ a: { b: { c: '1' } }, list: ['x'] }` (the SDK's form encoding). */
function parseForm(text) {
  const out = {};
  for (const [rawKey, value] of new URLSearchParams(text)) {
    const parts = rawKey.split(/\[|\]\[|\]/).filter((p) => p !== '');
    let node = out;
    parts.forEach((p, i) => {
      const last = i === parts.length - 1;
      if (last) {
        if (Array.isArray(node)) node.push(value);
        else node[p] = value;
        return;
      }
      const nextIsIndex = /^\d+$/.test(parts[i + 1] ?? '') || rawKey.endsWith('[]');
      if (node[p] === undefined) node[p] = nextIsIndex ? [] : {};
      node = node[p];
    });
  }
  return out;
}

function startStripeFake(opts = {}) {
  const apiKey = opts.apiKey ?? process.env.STRIPE_SECRET_KEY ?? 'sk_test_amberline_local';
  const webhookSecret = opts.webhookSecret ?? process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_amberline_local';
  const webhookUrl = opts.webhookUrl === undefined ? process.env.STRIPE_WEBHOOK_URL || null : opts.webhookUrl;
  const host = opts.host ?? '127.0.0.1';
  const log = opts.log ?? (() => {});
  const state = { paymentIntents: new Map(), refunds: new Map(), events: [], idempotency: new Map(), requests: [] };

  const error = (status, type, message, extra = {}) => ({ status, body: { error: { type, message, ...extra } } });
  const invalid = (message, param, code = 'parameter_invalid') => error(400, 'invalid_request_error', message, { code, ...(param ? { param } : {}) });
  const missing = (what, id) => error(404, 'invalid_request_error', `No such ${what}: '${id}'`, { code: 'resource_missing', param: 'id' });

  /** Builds, keeps and (when a URL is set) posts a signed event. */
  function emit(type, object) {
    const event = {
      id: rid('evt'),
      object: 'event',
      api_version: Stripe.API_VERSION ?? null,
      created: nowSec(),
      type,
      livemode: false,
      pending_webhooks: webhookUrl ? 1 : 0,
      request: { id: null, idempotency_key: null },
      data: { object: JSON.parse(JSON.stringify(object)) },
    };
    state.events.push(event);
    const payload = JSON.stringify(event);
    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
    if (opts.onEvent) {
      try {
        opts.onEvent(event, payload, header);
      } catch (e) {
        log(`onEvent failed: ${e.message}`);
      }
    }
    if (webhookUrl) void deliver(payload, header, event, 0);
    return event;
  }

  async function deliver(payload, header, event, attempt) {
    try {
      const res = await fetch(webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload });
      log(`webhook ${event.type} ${event.id} -> ${res.status}`);
      if (res.status >= 500 && attempt < 4) setTimeout(() => void deliver(payload, header, event, attempt + 1), 500 * 2 ** attempt).unref();
    } catch (e) {
      log(`webhook ${event.type} ${event.id} failed: ${e.message}`);
      if (attempt < 4) setTimeout(() => void deliver(payload, header, event, attempt + 1), 500 * 2 ** attempt).unref();
    }
  }

  function newPaymentIntent(p) {
    const id = rid('pi');
    return {
      id,
      object: 'payment_intent',
      amount: Number(p.amount),
      amount_capturable: 0,
      amount_received: 0,
      canceled_at: null,
      cancellation_reason: null,
      capture_method: p.capture_method ?? 'automatic',
      client_secret: `${id}_secret_${crypto.randomBytes(8).toString('hex')}`,
      confirmation_method: 'automatic',
      created: nowSec(),
      currency: String(p.currency).toLowerCase(),
      description: p.description ?? null,
      last_payment_error: null,
      latest_charge: null,
      livemode: false,
      metadata: p.metadata ?? {},
      payment_method: p.payment_method ?? null,
      payment_method_types: ['card'],
      status: p.payment_method ? 'requires_confirmation' : 'requires_payment_method',
      amount_refunded: 0,
    };
  }

  /** Confirms a PaymentIntent with its payment method; a declined method gives the 402 card error. */
  function confirm(pi, pm) {
    if (pm) pi.payment_method = pm;
    if (pi.status === 'succeeded' || pi.status === 'canceled') {
      return invalid(`This PaymentIntent's payment_method could not be updated because it has a status of ${pi.status}.`, undefined, 'payment_intent_unexpected_state');
    }
    if (!pi.payment_method) return invalid('You cannot confirm this PaymentIntent because it is missing a payment method.', 'payment_method', 'payment_intent_unexpected_state');
    const decline = DECLINES[pi.payment_method];
    if (decline) {
      const chargeId = rid('ch');
      pi.last_payment_error = { type: 'card_error', charge: chargeId, ...decline, payment_method: { id: pi.payment_method, object: 'payment_method', type: 'card' } };
      pi.status = 'requires_payment_method';
      pi.latest_charge = chargeId;
      emit('payment_intent.payment_failed', pi);
      return error(402, 'card_error', decline.message, { code: decline.code, decline_code: decline.decline_code, charge: chargeId, payment_intent: pi, doc_url: `https://stripe.com/docs/error-codes/${decline.code}` });
    }
    if (!GOOD_METHODS.has(pi.payment_method)) return missing('PaymentMethod', pi.payment_method);
    pi.status = 'succeeded';
    pi.latest_charge = rid('ch');
    pi.amount_received = pi.amount;
    pi.last_payment_error = null;
    emit('payment_intent.succeeded', pi);
    return { status: 200, body: pi };
  }

  function route(method, path, params) {
    let m;
    if (method === 'POST' && path === '/v1/payment_intents') {
      const amount = Number(params.amount);
      if (params.amount === undefined) return invalid('Missing required param: amount.', 'amount', 'parameter_missing');
      if (!Number.isInteger(amount)) return invalid('Invalid integer: ' + params.amount, 'amount', 'parameter_invalid_integer');
      if (amount < 50) return invalid('Amount must be at least $0.50 usd', 'amount', 'amount_too_small');
      if (amount > 99999999) return invalid('Amount must be no more than $999,999.99', 'amount', 'amount_too_large');
      if (!params.currency) return invalid('Missing required param: currency.', 'currency', 'parameter_missing');
      const pi = newPaymentIntent(params);
      state.paymentIntents.set(pi.id, pi);
      emit('payment_intent.created', pi);
      if (params.confirm === 'true') return confirm(pi, params.payment_method);
      return { status: 200, body: pi };
    }
    if ((m = path.match(/^\/v1\/payment_intents\/([^/]+)$/)) && method === 'GET') {
      const pi = state.paymentIntents.get(m[1]);
      return pi ? { status: 200, body: pi } : missing('payment_intent', m[1]);
    }
    if ((m = path.match(/^\/v1\/payment_intents\/([^/]+)\/confirm$/)) && method === 'POST') {
      const pi = state.paymentIntents.get(m[1]);
      return pi ? confirm(pi, params.payment_method) : missing('payment_intent', m[1]);
    }
    if ((m = path.match(/^\/v1\/payment_intents\/([^/]+)\/cancel$/)) && method === 'POST') {
      const pi = state.paymentIntents.get(m[1]);
      if (!pi) return missing('payment_intent', m[1]);
      if (pi.status === 'succeeded' || pi.status === 'canceled') {
        return invalid(`You cannot cancel this PaymentIntent because it has a status of ${pi.status}.`, undefined, 'payment_intent_unexpected_state');
      }
      pi.status = 'canceled';
      pi.canceled_at = nowSec();
      pi.cancellation_reason = params.cancellation_reason ?? null;
      emit('payment_intent.canceled', pi);
      return { status: 200, body: pi };
    }
    if (method === 'POST' && path === '/v1/refunds') {
      const pi = state.paymentIntents.get(params.payment_intent ?? '');
      if (!params.payment_intent) return invalid('One of the following params should be provided for this request: payment_intent or charge.', 'payment_intent', 'parameter_missing');
      if (!pi) return missing('payment_intent', params.payment_intent);
      if (pi.status !== 'succeeded') return invalid(`This PaymentIntent (${pi.id}) does not have a successful charge to refund.`, 'payment_intent', 'charge_not_refundable');
      const left = pi.amount_received - pi.amount_refunded;
      const amount = params.amount === undefined ? left : Number(params.amount);
      if (!Number.isInteger(amount) || amount <= 0) return invalid('Invalid positive integer', 'amount', 'parameter_invalid_integer');
      if (left <= 0) return invalid(`Charge ${pi.latest_charge} has already been refunded.`, undefined, 'charge_already_refunded');
      if (amount > left) return invalid(`Refund amount ($${(amount / 100).toFixed(2)}) is greater than unrefunded amount on charge ($${(left / 100).toFixed(2)})`, 'amount', 'amount_too_large');
      pi.amount_refunded += amount;
      const refund = {
        id: rid('re'),
        object: 'refund',
        amount,
        currency: pi.currency,
        charge: pi.latest_charge,
        payment_intent: pi.id,
        reason: params.reason ?? null,
        metadata: params.metadata ?? {},
        status: 'succeeded',
        created: nowSec(),
      };
      state.refunds.set(refund.id, refund);
      emit('refund.created', refund);
      emit('charge.refunded', {
        id: pi.latest_charge, object: 'charge', amount: pi.amount_received, amount_refunded: pi.amount_refunded, currency: pi.currency,
        payment_intent: pi.id, refunded: pi.amount_refunded >= pi.amount_received, status: 'succeeded', metadata: pi.metadata,
      });
      return { status: 200, body: refund };
    }
    if ((m = path.match(/^\/v1\/refunds\/([^/]+)$/)) && method === 'GET') {
      const r = state.refunds.get(m[1]);
      return r ? { status: 200, body: r } : missing('refund', m[1]);
    }
    if (method === 'GET' && path === '/v1/events') {
      return { status: 200, body: { object: 'list', url: '/v1/events', has_more: false, data: [...state.events].reverse().slice(0, 100) } };
    }
    return error(404, 'invalid_request_error', `Unrecognized request URL (${method}: ${path}).`);
  }

  const server = http.createServer((req, res) => {
    const chunks = [];
    req.on('data', (c) => chunks.push(c));
    req.on('end', () => {
      const requestId = rid('req');
      const send = (status, body, headers = {}) => {
        const text = JSON.stringify(body);
        res.writeHead(status, { 'content-type': 'application/json', 'request-id': requestId, 'content-length': Buffer.byteLength(text), ...headers });
        res.end(text);
      };
      const url = new URL(req.url ?? '/', 'http://fake');
      const text = Buffer.concat(chunks).toString('utf8');
      const params = req.method === 'GET' ? parseForm(url.search.slice(1)) : parseForm(text);
      state.requests.push({ method: req.method, path: url.pathname, params, idempotencyKey: req.headers['idempotency-key'] ?? null });
      const auth = req.headers.authorization ?? '';
      const basic = auth.startsWith('Basic ') ? Buffer.from(auth.slice(6), 'base64').toString('utf8').split(':')[0] : null;
      if (auth !== `Bearer ${apiKey}` && basic !== apiKey) {
        send(401, { error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' } });
        return;
      }
      const key = req.method === 'POST' ? req.headers['idempotency-key'] : undefined;
      if (key) {
        const seen = state.idempotency.get(key);
        const fingerprint = `${req.method} ${url.pathname} ${text}`;
        if (seen) {
          if (seen.fingerprint !== fingerprint) {
            send(400, { error: { type: 'idempotency_error', message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.` } });
          } else send(seen.status, seen.body, { 'idempotent-replayed': 'true', 'idempotency-key': key });
          return;
        }
        const out = route(req.method, url.pathname, params);
        state.idempotency.set(key, { fingerprint, status: out.status, body: out.body });
        send(out.status, out.body, { 'idempotency-key': key });
        return;
      }
      const out = route(req.method ?? 'GET', url.pathname, params);
      send(out.status, out.body);
    });
  });

  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? Number(process.env.STRIPE_API_PORT ?? 12111), host, () => {
      const port = server.address().port;
      resolve({
        port,
        host,
        state,
        webhookSecret,
        apiKey,
        close: () =>
          new Promise((r) => {
            server.close(() => r());
            server.closeAllConnections();
          }),
      });
    });
  });
}

module.exports = { startStripeFake, parseForm, DECLINES, GOOD_METHODS };

if (require.main === module) {
  startStripeFake({ log: (l) => process.stdout.write(`stripe-fake: ${l}\n`) }).then(
    (f) => {
      process.stdout.write(`stripe-fake: listening on http://${f.host}:${f.port}${process.env.STRIPE_WEBHOOK_URL ? `, events to ${process.env.STRIPE_WEBHOOK_URL}` : ''}\n`);
      const stop = () => f.close().then(() => process.exit(0));
      process.on('SIGTERM', stop);
      process.on('SIGINT', stop);
    },
    (e) => {
      process.stderr.write(`stripe-fake: ${e.message}\n`);
      process.exit(1);
    },
  );
}
