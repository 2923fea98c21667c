import { join, resolve } from 'node:path';
import { Global, Module } from '@nestjs/common';

/**
 * The one reader of the environment. Every setting and its default is here; `env.validation.ts` checks the same
 * variables at start-up (main.ts) and in the config module, with these defaults. Nothing else reads `process.env`.
 */
export const environment = (): NodeJS.ProcessEnv => process.env;

/** The defaults of the optional settings (the development machine's local services). */
export const DEFAULTS = {
  DATABASE_URL: 'postgres://postgres@127.0.0.1:54329/amberline',
  JWT_EXPIRES_IN: '12h',
  PORT: 3000,
  HOST: '127.0.0.1',
  NODE_ENV: 'development',
  STRIPE_API_HOST: '127.0.0.1',
  STRIPE_API_PORT: 12111,
  SMTP_HOST: '127.0.0.1',
  SMTP_PORT: '1025',
  MAIL_FROM: 'Amberline dispatch <dispatch@amberline.example>',
  APP_URL: 'http://127.0.0.1:3000',
  MAIL_CHANNEL: 'default',
  /** Outbox worker and escort reminder periods when unset (off under NODE_ENV=test). */
  MAIL_SEND_INTERVAL_MS: 5_000,
  ESCORT_REMINDER_INTERVAL_MS: 300_000,
} as const;

/** The local payment processor stand-in's key and webhook secret, written in the repository: development and tests only. */
export const LOCAL_STRIPE_KEY = 'sk_test_amberline_local';
export const LOCAL_WEBHOOK_SECRET = 'whsec_amberline_local';

export type StripeSettings = { secretKey: string; host: string; port: number; protocol: 'http' | 'https'; webhookSecret: string };

export type AppConfig = {
  databaseUrl: string;
  nodeEnv: string;
  port: number;
  host: string;
  jwt: { secret: string | undefined; expiresIn: string };
  /** The built front end served next to the API. */
  frontendDist: string;
  /** TRUST_PROXY as Express reads it: a hop count, or addresses / subnets / names; false when unset. */
  trustProxy: boolean | number | string;
  /** Where permit PDFs are kept (by SHA-256). */
  fileStoreDir: string;
  stripe: StripeSettings;
  mail: { smtpHost: string; smtpPort: number; from: string; appUrl: string; channel: string; sendIntervalMs: number };
  escortReminderIntervalMs: number;
};

const ROOT = join(__dirname, '..', '..', '..');
const set = (v: string | undefined): v is string => v !== undefined && v !== '';

/** TRUST_PROXY as Express reads it: a hop count, or addresses / subnets / names; false when unset. */
export function trustProxySetting(raw: string | undefined): boolean | number | string {
  const v = raw?.trim();
  if (!v || v === 'false') return false;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}

/**
 * The processor's settings. Outside production a missing key or webhook secret falls back to the local stand-in's;
 * in production there is no fallback (start-up refuses it, see env.validation).
 */
export function stripeSettings(env: NodeJS.ProcessEnv = environment()): StripeSettings {
  const production = env.NODE_ENV === 'production';
  const secretKey = env.STRIPE_SECRET_KEY || (production ? '' : LOCAL_STRIPE_KEY);
  const webhookSecret = env.STRIPE_WEBHOOK_SECRET || (production ? '' : LOCAL_WEBHOOK_SECRET);
  if (production && (!secretKey || !webhookSecret)) throw new Error('STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET must be set in production');
  return {
    secretKey,
    host: env.STRIPE_API_HOST || DEFAULTS.STRIPE_API_HOST,
    port: Number(env.STRIPE_API_PORT || DEFAULTS.STRIPE_API_PORT),
    protocol: env.STRIPE_API_PROTOCOL === 'https' ? 'https' : 'http',
    webhookSecret,
  };
}

/**
 * A schedule period in ms. Unset under NODE_ENV=test it is 0 (off): test processes run the worker themselves, and
 * only a server started with the setting runs one.
 */
export function intervalSetting(env: NodeJS.ProcessEnv, key: string, fallbackMs: number): number {
  const v = env[key];
  if (set(v)) return Number(v);
  return env.NODE_ENV === 'test' ? 0 : fallbackMs;
}

/** Every setting, from `env` (the process environment unless given), with the defaults above. */
export function readAppConfig(env: NodeJS.ProcessEnv = environment()): AppConfig {
  return {
    databaseUrl: env.DATABASE_URL || DEFAULTS.DATABASE_URL,
    nodeEnv: env.NODE_ENV || DEFAULTS.NODE_ENV,
    port: Number(env.PORT || DEFAULTS.PORT),
    host: env.HOST || DEFAULTS.HOST,
    jwt: { secret: env.JWT_SECRET, expiresIn: env.JWT_EXPIRES_IN || DEFAULTS.JWT_EXPIRES_IN },
    frontendDist: resolve(env.FRONTEND_DIST ?? join(ROOT, 'frontend', 'dist')),
    trustProxy: trustProxySetting(env.TRUST_PROXY),
    fileStoreDir: resolve(env.FILE_STORE_DIR || join(ROOT, '.data', 'files')),
    stripe: stripeSettings(env),
    mail: {
      smtpHost: env.SMTP_HOST || DEFAULTS.SMTP_HOST,
      smtpPort: Number(env.SMTP_PORT || DEFAULTS.SMTP_PORT),
      from: env.MAIL_FROM || DEFAULTS.MAIL_FROM,
      appUrl: (env.APP_URL || DEFAULTS.APP_URL).replace(/\/+$/, ''),
      channel: env.MAIL_CHANNEL || DEFAULTS.MAIL_CHANNEL,
      sendIntervalMs: intervalSetting(env, 'MAIL_SEND_INTERVAL_MS', DEFAULTS.MAIL_SEND_INTERVAL_MS),
    },
    escortReminderIntervalMs: intervalSetting(env, 'ESCORT_REMINDER_INTERVAL_MS', DEFAULTS.ESCORT_REMINDER_INTERVAL_MS),
  };
}

/** The settings as a provider: inject with `@Inject(APP_CONFIG) config: AppConfig`. */
export const APP_CONFIG = Symbol('APP_CONFIG');

@Global()
@Module({
  providers: [{ provide: APP_CONFIG, useFactory: () => readAppConfig() }],
  exports: [APP_CONFIG],
})
export class AppConfigModule {}
