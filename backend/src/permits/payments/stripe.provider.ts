import Stripe from 'stripe';

export const STRIPE = Symbol('STRIPE');
export type StripeClient = InstanceType<typeof Stripe>;

/** Settings read from the environment when the client is made; the defaults are the local fake's. */
export function stripeSettings(env: NodeJS.ProcessEnv = process.env) {
  return {
    secretKey: env.STRIPE_SECRET_KEY || 'sk_test_amberline_local',
    host: env.STRIPE_API_HOST || '127.0.0.1',
    port: Number(env.STRIPE_API_PORT || 12111),
    protocol: (env.STRIPE_API_PROTOCOL === 'https' ? 'https' : 'http') as 'http' | 'https',
    webhookSecret: env.STRIPE_WEBHOOK_SECRET || 'whsec_amberline_local',
  };
}

/** The official SDK pointed at the configured API host (the local fake in development and tests). */
export function createStripeClient(env: NodeJS.ProcessEnv = process.env): StripeClient {
  const s = stripeSettings(env);
  return new Stripe(s.secretKey, { host: s.host, port: s.port, protocol: s.protocol, maxNetworkRetries: 0, telemetry: false, timeout: 10_000 });
}
