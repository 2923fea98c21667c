/**
 * Outages that do not sign people out, tokens that must expire, 429 with Retry-After, the client address from a
 * proxy only when one is configured, and production refusing to start on the repository's secrets.
 */
import 'reflect-metadata';
import { sign } from 'jsonwebtoken';
import { validateEnv } from '../src/config/env.validation';
import { trustProxySetting } from '../src/configure-app';
import { stripeSettings } from '../src/permits/payments/stripe.provider';
import { createTestApp, nextIp, type TestApp } from './utils/create-test-app';

describe('sessions, limits and secrets', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('a token without an expiry is refused, one with it is accepted', async () => {
    const u = await t.signedIn({ role: 'dispatcher' });
    const secret = process.env.JWT_SECRET!;
    const forever = sign({ sub: u.id, role: 'dispatcher' }, secret, { algorithm: 'HS256' });
    expect((await t.http().get('/api/auth/me').set('authorization', `Bearer ${forever}`)).status).toBe(401);
    const dated = sign({ sub: u.id, role: 'dispatcher' }, secret, { algorithm: 'HS256', expiresIn: '5m' });
    expect((await t.http().get('/api/auth/me').set('authorization', `Bearer ${dated}`)).status).toBe(200);
  });

  it('a throttled sign-in answers 429 with Retry-After', async () => {
    const ip = nextIp();
    const email = `throttle.${Date.now()}@test.amberline.example`;
    for (let i = 0; i < 10; i++) await t.http().post('/api/auth/login').set('x-forwarded-for', ip).send({ email, password: 'wrong-password' });
    const blocked = await t.http().post('/api/auth/login').set('x-forwarded-for', ip).send({ email, password: 'wrong-password' });
    expect(blocked.status).toBe(429);
    expect(blocked.headers['retry-after']).toBe('60');
  });

  it('X-Forwarded-For is believed only from a configured proxy', () => {
    expect(trustProxySetting(undefined)).toBe(false);
    expect(trustProxySetting('')).toBe(false);
    expect(trustProxySetting('loopback')).toBe('loopback');
    expect(trustProxySetting('2')).toBe(2);
  });

  it('production refuses to start without its secrets, or with the values written in the repository', () => {
    const base = { DATABASE_URL: 'postgres://postgres@127.0.0.1:5432/x', NODE_ENV: 'production' };
    expect(() => validateEnv({ ...base, JWT_SECRET: 'a-machine-secret-of-32-chars-xxxx' })).toThrow(/STRIPE_SECRET_KEY: must be set in production[\s\S]*STRIPE_WEBHOOK_SECRET: must be set in production/);
    expect(() => validateEnv({ ...base, JWT_SECRET: 'test-secret-not-for-production', STRIPE_SECRET_KEY: 'sk_test_amberline_local', STRIPE_WEBHOOK_SECRET: 'whsec_amberline_local' })).toThrow(
      /JWT_SECRET: is the development value written in the repository[\s\S]*STRIPE_SECRET_KEY: is the development value[\s\S]*STRIPE_WEBHOOK_SECRET: is the development value/,
    );
    expect(() => validateEnv({ ...base, JWT_SECRET: 'a-machine-secret-of-32-chars-xxxx', STRIPE_SECRET_KEY: 'sk_test_0123456789abcdef', STRIPE_WEBHOOK_SECRET: 'whsec_0123456789abcdef' })).not.toThrow();
    expect(() => stripeSettings({ NODE_ENV: 'production' })).toThrow(/must be set in production/);
    expect(stripeSettings({ NODE_ENV: 'test' }).webhookSecret).toBe('whsec_amberline_local');
  });

  it('while the database cannot be reached a signed-in user gets 503 with Retry-After, never 401', async () => {
    // an app of its own, whose database connection is closed under it
    const own = await createTestApp();
    const u = await own.signedIn({ role: 'permit_clerk' });
    await own.ds.destroy();
    const res = await own.http().get('/api/auth/me').set('authorization', `Bearer ${u.token}`);
    expect(res.status).toBe(503);
    expect(res.body.error).toBe('service_unavailable');
    expect(res.headers['retry-after']).toBeDefined();
    await own.app.close().catch(() => undefined);
  });
});
