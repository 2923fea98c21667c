import Stripe from 'stripe';
import { LOCAL_STRIPE_KEY, LOCAL_WEBHOOK_SECRET, stripeSettings, type StripeSettings } from '../../config/app-config';

export const STRIPE = Symbol('STRIPE');
/** The processor's settings (from the app's configuration). */
export const STRIPE_SETTINGS = Symbol('STRIPE_SETTINGS');
export type StripeClient = InstanceType<typeof Stripe>;
export { LOCAL_STRIPE_KEY, LOCAL_WEBHOOK_SECRET, stripeSettings, type StripeSettings };

/** The official SDK pointed at the configured API host (the local stand-in in development and tests). */
export function createStripeClient(s: StripeSettings): StripeClient {
  return new Stripe(s.secretKey, { host: s.host, port: s.port, protocol: s.protocol, maxNetworkRetries: 0, telemetry: false, timeout: 10_000 });
}
