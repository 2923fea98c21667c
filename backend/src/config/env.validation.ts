import { plainToInstance, Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Matches, Max, Min, MinLength, validateSync } from 'class-validator';
import { DEFAULTS, LOCAL_STRIPE_KEY, LOCAL_WEBHOOK_SECRET } from './app-config';

/** Environment the server needs. A missing or bad value stops start-up with a message naming it. */
export class EnvironmentVariables {
  @Matches(/^postgres(ql)?:\/\//, { message: 'DATABASE_URL must be a postgres:// URL' })
  DATABASE_URL: string;

  @IsString()
  @MinLength(16, { message: 'JWT_SECRET must be at least 16 characters' })
  JWT_SECRET: string;

  @IsOptional()
  @Matches(/^\d+[smhd]$/, { message: 'JWT_EXPIRES_IN must look like 30m, 12h or 7d' })
  JWT_EXPIRES_IN: string = DEFAULTS.JWT_EXPIRES_IN;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(65535)
  PORT: number = DEFAULTS.PORT;

  @IsOptional()
  @IsString()
  HOST: string = DEFAULTS.HOST;

  @IsOptional()
  @IsString()
  FRONTEND_DIST?: string;

  @IsOptional()
  @IsIn(['development', 'production', 'test'])
  NODE_ENV: string = DEFAULTS.NODE_ENV;

  // Payments (permits module). Without them the local stand-in's settings apply (see stripeSettings in app-config).
  @IsOptional()
  @Matches(/^sk_(test|live)_[A-Za-z0-9_]+$/, { message: 'STRIPE_SECRET_KEY must look like sk_test_…' })
  STRIPE_SECRET_KEY?: string;

  @IsOptional()
  @IsString()
  STRIPE_API_HOST?: string;

  @IsOptional()
  @Matches(/^\d{1,5}$/, { message: 'STRIPE_API_PORT must be a port number' })
  STRIPE_API_PORT?: string;

  @IsOptional()
  @IsIn(['http', 'https'])
  STRIPE_API_PROTOCOL?: string;

  @IsOptional()
  @Matches(/^whsec_[A-Za-z0-9_]+$/, { message: 'STRIPE_WEBHOOK_SECRET must look like whsec_…' })
  STRIPE_WEBHOOK_SECRET?: string;

  /** The reverse proxy whose X-Forwarded-For is believed (Express "trust proxy": loopback, a subnet, a hop count); unset = none. */
  @IsOptional()
  @Matches(/^[A-Za-z0-9.:/, -]{1,200}$/, { message: 'TRUST_PROXY must be a hop count or a list of addresses, subnets or loopback/linklocal/uniquelocal' })
  TRUST_PROXY?: string;

  /** Where permit PDFs are stored (by SHA-256); default `.data/files` under the project. */
  @IsOptional()
  @IsString()
  FILE_STORE_DIR?: string;

  // Mail (escorts module): nodemailer over SMTP to the local catcher `npm start` runs (maildev on 1025).
  @IsOptional()
  @IsString()
  SMTP_HOST: string = DEFAULTS.SMTP_HOST;

  @IsOptional()
  @Matches(/^\d{1,5}$/, { message: 'SMTP_PORT must be a port number' })
  SMTP_PORT: string = DEFAULTS.SMTP_PORT;

  @IsOptional()
  @Matches(/^(.+<[^@\s]+@[^@\s]+>|[^@\s<>]+@[^@\s<>]+)$/, { message: 'MAIL_FROM must be an address, or "Name <address>"' })
  MAIL_FROM: string = DEFAULTS.MAIL_FROM;

  /** Base of links in e-mails (the vendor's answer page). */
  @IsOptional()
  @Matches(/^https?:\/\/[^\s/]+(\/[^\s]*)?$/, { message: 'APP_URL must be an http(s) URL' })
  APP_URL: string = DEFAULTS.APP_URL;

  /** Outbox channel this instance sends; instances on one database share `default`. */
  @IsOptional()
  @Matches(/^[a-z0-9._-]{1,80}$/, { message: 'MAIL_CHANNEL must be 1–80 of a-z, 0-9, . _ -' })
  MAIL_CHANNEL: string = DEFAULTS.MAIL_CHANNEL;

  /** How often the outbox worker runs, in ms; 0 turns the schedule off. Unset: 5 s, or off when NODE_ENV=test. */
  @IsOptional()
  @Matches(/^\d{1,8}$/, { message: 'MAIL_SEND_INTERVAL_MS must be a whole number of milliseconds' })
  MAIL_SEND_INTERVAL_MS?: string;

  /** How often escort reminders are looked for, in ms; 0 turns the schedule off. Unset: 5 min, or off when NODE_ENV=test. */
  @IsOptional()
  @Matches(/^\d{1,8}$/, { message: 'ESCORT_REMINDER_INTERVAL_MS must be a whole number of milliseconds' })
  ESCORT_REMINDER_INTERVAL_MS?: string;
}

/** Secrets written in the repository (test scripts, the local fake): never accepted in production. */
const REPOSITORY_SECRETS: Record<string, string[]> = {
  JWT_SECRET: ['test-secret-not-for-production'],
  STRIPE_SECRET_KEY: [LOCAL_STRIPE_KEY],
  STRIPE_WEBHOOK_SECRET: [LOCAL_WEBHOOK_SECRET],
};

/** In production every secret must be set, and none may be a value written in the repository. */
function productionSecretProblems(env: EnvironmentVariables): string[] {
  if (env.NODE_ENV !== 'production') return [];
  const out: string[] = [];
  for (const [name, known] of Object.entries(REPOSITORY_SECRETS)) {
    const v = (env as unknown as Record<string, string | undefined>)[name];
    if (!v) out.push(`  ${name}: must be set in production`);
    else if (known.includes(v)) out.push(`  ${name}: is the development value written in the repository; set this machine's own secret`);
  }
  return out;
}

export function validateEnv(config: Record<string, unknown>): EnvironmentVariables {
  const env = plainToInstance(EnvironmentVariables, config, { enableImplicitConversion: false });
  const errors = validateSync(env, { skipMissingProperties: false, whitelist: false });
  const lines = [...errors.map((e) => `  ${e.property}: ${Object.values(e.constraints ?? {}).join('; ') || 'invalid'}`), ...productionSecretProblems(env)];
  if (lines.length > 0) throw new Error(`Invalid environment configuration:\n${lines.join('\n')}`);
  return env;
}
