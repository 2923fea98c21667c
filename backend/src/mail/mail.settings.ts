import { ConfigService } from '@nestjs/config';
import { DEFAULTS } from '../config/app-config';

/** How this instance sends mail. One provider, so tests can give their own (an in-process catcher, a channel of their own). */
export type MailSettings = {
  smtpHost: string;
  smtpPort: number;
  from: string;
  /** Base of links in e-mails, without a trailing slash. */
  appUrl: string;
  /** Outbox rows this instance writes and sends. */
  channel: string;
  /** Worker period in ms; 0 = no schedule (call `sendDue` yourself). */
  sendIntervalMs: number;
  /** Attempts before a message is marked failed. */
  maxAttempts: number;
  /** First retry delay; doubles on each further failure, up to `maxBackoffMs`. */
  baseBackoffMs: number;
  maxBackoffMs: number;
  /** SMTP connection and greeting timeouts, so an unreachable server fails fast and is retried later. */
  timeoutMs: number;
};

export const MAIL_SETTINGS = Symbol('MAIL_SETTINGS');

/**
 * A schedule period from the environment. Unset under NODE_ENV=test it is 0 (off): test processes call the worker
 * themselves, and only a server started with the setting (npm test exports it for the browser-test server) runs one.
 */
export function intervalFrom(config: ConfigService, key: string, fallbackMs: number): number {
  const v = config.get<string>(key);
  if (v !== undefined && v !== '') return Number(v);
  return config.get<string>('NODE_ENV') === 'test' ? 0 : fallbackMs;
}

export function mailSettingsFrom(config: ConfigService): MailSettings {
  return {
    smtpHost: config.get<string>('SMTP_HOST') ?? DEFAULTS.SMTP_HOST,
    smtpPort: Number(config.get<string>('SMTP_PORT') ?? DEFAULTS.SMTP_PORT),
    from: config.get<string>('MAIL_FROM') ?? DEFAULTS.MAIL_FROM,
    appUrl: (config.get<string>('APP_URL') ?? DEFAULTS.APP_URL).replace(/\/+$/, ''),
    channel: config.get<string>('MAIL_CHANNEL') ?? DEFAULTS.MAIL_CHANNEL,
    sendIntervalMs: intervalFrom(config, 'MAIL_SEND_INTERVAL_MS', DEFAULTS.MAIL_SEND_INTERVAL_MS),
    maxAttempts: 20,
    baseBackoffMs: 30_000,
    maxBackoffMs: 3_600_000,
    timeoutMs: 5_000,
  };
}

/** Delay before attempt `attempts + 1`, after `attempts` failures: base × 2^(attempts − 1), capped. */
export function backoffMs(attempts: number, s: Pick<MailSettings, 'baseBackoffMs' | 'maxBackoffMs'>): number {
  return Math.min(s.maxBackoffMs, s.baseBackoffMs * 2 ** Math.max(0, attempts - 1));
}
