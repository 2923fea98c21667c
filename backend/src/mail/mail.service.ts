import { Inject, Injectable, Logger } from '@nestjs/common';
import { createTransport, type Transporter } from 'nodemailer';
import type { EntityManager } from 'typeorm';
import { DOMAIN_ERRORS, DomainError, type MailStatus, type OutboxMessageDto } from '@amberline/common';
import type { OutboxMessage, StoredAttachment } from './entities/outbox-message.entity';
import { MailRepository } from './mail.repository';
import { backoffMs, MAIL_SETTINGS, type MailSettings } from './mail.settings';

/** An e-mail to write to the outbox. */
export type OutgoingMail = {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; contentType: string; content: string | Buffer }[];
  /** A message with a key already in the outbox is not written again (e.g. `escort-reminder:<booking id>`). */
  dedupeKey?: string;
  /** What the message is about, for tracing (e.g. `{ entity: 'escort_booking', id }`). */
  related?: { entity: string; id: string };
};

export type SendReport = { sent: number; retrying: number; failed: number };

/** Errors that mean the server could not be reached or talked to: the whole batch waits for the next run. */
const CONNECTION_ERRORS = new Set(['ECONNECTION', 'ETIMEDOUT', 'ESOCKET', 'EDNS', 'ECONNREFUSED', 'EGREETING']);

export function toOutboxDto(m: OutboxMessage): OutboxMessageDto {
  return {
    id: m.id,
    to: m.toAddresses,
    subject: m.subject,
    status: m.status,
    attempts: m.attempts,
    nextAttemptAt: m.status === 'pending' ? m.nextAttemptAt.toISOString() : null,
    lastError: m.lastError,
    smtpMessageId: m.smtpMessageId,
    sentAt: m.sentAt?.toISOString() ?? null,
    createdAt: m.createdAt.toISOString(),
  };
}

/**
 * The durable mail outbox. `enqueue` writes a message inside the caller's transaction, so the mail exists exactly
 * when the change that causes it commits. `sendDue` sends what is due over SMTP, one row per transaction, each row
 * locked with FOR UPDATE SKIP LOCKED while it is sent: several workers (threads or server instances) never take
 * the same row, and a row is marked sent in the same transaction that held it.
 */
@Injectable()
export class MailService {
  private readonly logger = new Logger('Mail');

  constructor(
    private readonly repo: MailRepository,
    @Inject(MAIL_SETTINGS) readonly settings: MailSettings,
  ) {}

  /** Writes one message to the outbox inside `manager`'s transaction. Returns its id, or null when its dedupe key was already used. */
  async enqueue(manager: EntityManager, mail: OutgoingMail): Promise<string | null> {
    const to = (Array.isArray(mail.to) ? mail.to : [mail.to]).map((a) => a.trim()).filter(Boolean);
    if (!to.length) throw new Error('an e-mail needs at least one recipient');
    const attachments: StoredAttachment[] = (mail.attachments ?? []).map((a) => ({
      filename: a.filename,
      contentType: a.contentType,
      contentBase64: Buffer.from(a.content).toString('base64'),
    }));
    return this.repo.insert(manager, {
      channel: this.settings.channel, to, subject: mail.subject.slice(0, 300), text: mail.text, html: mail.html ?? null, attachments,
      dedupeKey: mail.dedupeKey ?? null, relatedEntity: mail.related?.entity ?? null, relatedId: mail.related?.id ?? null,
    });
  }

  private transport(): Transporter {
    const s = this.settings;
    return createTransport({
      host: s.smtpHost,
      port: s.smtpPort,
      secure: false,
      ignoreTLS: true,
      connectionTimeout: s.timeoutMs,
      greetingTimeout: s.timeoutMs,
      socketTimeout: s.timeoutMs * 3,
    });
  }

  /** Sends the messages of this instance's channel that are due at `now`, at most `limit` of them. */
  async sendDue(now: Date = new Date(), limit = 50): Promise<SendReport> {
    const report: SendReport = { sent: 0, retrying: 0, failed: 0 };
    const transport = this.transport();
    try {
      for (let i = 0; i < limit; i++) {
        const outcome = await this.repo.transaction(async (m) => {
          const row = await this.repo.takeDue(m, this.settings.channel, now);
          if (!row) return 'none' as const;
          try {
            const info = await transport.sendMail({
              from: this.settings.from,
              to: row.to_addresses,
              subject: row.subject,
              text: row.text_body,
              ...(row.html_body ? { html: row.html_body } : {}),
              // the same Message-ID on every attempt, so a receiver can tell a repeat
              messageId: `<${row.id}@outbox.amberline>`,
              attachments: row.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.contentBase64, 'base64') })),
            });
            await this.repo.markSent(m, row.id, now, String(info.messageId ?? '').slice(0, 300), String(info.response ?? '').slice(0, 1000));
            return 'sent' as const;
          } catch (e) {
            const err = e as Error & { code?: string; responseCode?: number };
            const attempts = row.attempts + 1;
            const permanent = typeof err.responseCode === 'number' && err.responseCode >= 500 && err.responseCode < 600;
            const failed = permanent || attempts >= this.settings.maxAttempts;
            const next = new Date(now.getTime() + backoffMs(attempts, this.settings));
            await this.repo.markAttemptFailed(m, row.id, failed ? 'failed' : 'pending', attempts, next, `${err.code ? `${err.code}: ` : ''}${err.message}`.slice(0, 1000));
            if (failed) this.logger.warn(`mail ${row.id} failed for good after ${attempts} attempt(s): ${err.message}`);
            return failed ? ('failed' as const) : CONNECTION_ERRORS.has(err.code ?? '') ? ('unreachable' as const) : ('retrying' as const);
          }
        });
        if (outcome === 'none') break;
        if (outcome === 'sent') report.sent++;
        else if (outcome === 'failed') report.failed++;
        else report.retrying++;
        // the server is not there: the other due messages wait for the next run instead of each timing out now
        if (outcome === 'unreachable') break;
      }
    } finally {
      transport.close();
    }
    return report;
  }

  async list(status: MailStatus | undefined, limit: number): Promise<OutboxMessageDto[]> {
    return (await this.repo.list(status, limit)).map(toOutboxDto);
  }

  /** Puts a failed message back in the queue, due now. */
  async retry(id: string, now: Date): Promise<OutboxMessageDto> {
    if (!(await this.repo.requeueFailed(id, now))) {
      const exists = await this.repo.find(id);
      if (!exists) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No message ${id}`);
      throw new DomainError(DOMAIN_ERRORS.TRANSITION_REFUSED, `Message ${id} is ${exists.status}; only a failed message can be retried`);
    }
    const message = await this.repo.find(id);
    if (!message) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No message ${id}`);
    return toOutboxDto(message);
  }
}
