import Stripe from 'stripe';

export const STRIPE = Symbol('STRIPE');
export type StripeClient = InstanceType<typeof Stripe>;

/** The local fake's key and webhook secret, written in the repository: for development and tests only. */
export const LOCAL_STRIPE_KEY = 'sk_test_amberline_local';
export const LOCAL_WEBHOOK_SECRET = 'whsec_amberline_local';

/**
 * Settings read from the environment when the client is made. Outside production a missing key or webhook secret
 * falls back to the local fake's; in production there is no fallback (start-up refuses it, see env.validation).
 */
export function stripeSettings(env: NodeJS.ProcessEnv = process.env) {
  const production = env.NODE_ENV === 'production';
  const secretKey = env.STRIPE_SECRET_KEY || (production ? '' : LOCAL_STRIPE_KEY);
  const webhookSecret = env.STRIPE_WEBHOOK_SECRET || (production ? '' : LOCAL_WEBHOOK_SECRET);
  if (production && (!secretKey || !webhookSecret)) throw new Error('STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET must be set in production');
  return {
    secretKey,
    host: env.STRIPE_API_HOST || '127.0.0.1',
    port: Number(env.STRIPE_API_PORT || 12111),
    protocol: (env.STRIPE_API_PROTOCOL === 'https' ? 'https' : 'http') as 'http' | 'https',
    webhookSecret,
  };
}

/** The official SDK pointed at the configured API host (the local fake in development and tests). */
export function createStripeClient(env: NodeJS.ProcessEnv = process.env): StripeClient {
  const s = stripeSettings(env);
  return new Stripe(s.secretKey, { host: s.host, port: s.port, protocol: s.protocol, maxNetworkRetries: 0, telemetry: false, timeout: 10_000 });
}
