import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { createTransport, type Transporter } from 'nodemailer';
import { DataSource, EntityManager, Repository } from 'typeorm';
import type { MailStatus, OutboxMessageDto } from '@amberline/common';
import { AppException } from '../core/app-exception';
import { OutboxMessage, type StoredAttachment } from './entities/outbox-message.entity';
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

type OutboxRow = {
  id: string;
  to_addresses: string[];
  subject: string;
  text_body: string;
  html_body: string | null;
  attachments: StoredAttachment[];
  attempts: number;
};

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
    private readonly ds: DataSource,
    @Inject(MAIL_SETTINGS) readonly settings: MailSettings,
    @InjectRepository(OutboxMessage) private readonly outbox: Repository<OutboxMessage>,
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
    const rows: { id: string }[] = await manager.query(
      `INSERT INTO mail_outbox (channel, to_addresses, subject, text_body, html_body, attachments, dedupe_key, related_entity, related_id)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)
       ON CONFLICT (dedupe_key) DO NOTHING RETURNING id`,
      [
        this.settings.channel, to, mail.subject.slice(0, 300), mail.text, mail.html ?? null, JSON.stringify(attachments),
        mail.dedupeKey ?? null, mail.related?.entity ?? null, mail.related?.id ?? null,
      ],
    );
    return rows[0]?.id ?? null;
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
        const outcome = await this.ds.transaction(async (m) => {
          const rows: OutboxRow[] = await m.query(
            `SELECT id, to_addresses, subject, text_body, html_body, attachments, attempts FROM mail_outbox
             WHERE status = 'pending' AND channel = $1 AND next_attempt_at <= $2
             ORDER BY next_attempt_at, created_at LIMIT 1 FOR UPDATE SKIP LOCKED`,
            [this.settings.channel, now],
          );
          const row = rows[0];
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
            await m.query(
              `UPDATE mail_outbox SET status = 'sent', attempts = attempts + 1, sent_at = $2, smtp_message_id = $3, smtp_response = $4, last_error = NULL WHERE id = $1`,
              [row.id, now, String(info.messageId ?? '').slice(0, 300), String(info.response ?? '').slice(0, 1000)],
            );
            return 'sent' as const;
          } catch (e) {
            const err = e as Error & { code?: string; responseCode?: number };
            const attempts = row.attempts + 1;
            const permanent = typeof err.responseCode === 'number' && err.responseCode >= 500 && err.responseCode < 600;
            const failed = permanent || attempts >= this.settings.maxAttempts;
            const next = new Date(now.getTime() + backoffMs(attempts, this.settings));
            await m.query(`UPDATE mail_outbox SET status = $2, attempts = $3, next_attempt_at = $4, last_error = $5 WHERE id = $1`, [
              row.id, failed ? 'failed' : 'pending', attempts, next, `${err.code ? `${err.code}: ` : ''}${err.message}`.slice(0, 1000),
            ]);
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
    const rows = await this.outbox.find({ where: status ? { status } : {}, order: { createdAt: 'DESC' }, take: limit });
    return rows.map(toOutboxDto);
  }

  /** Puts a failed message back in the queue, due now. */
  async retry(id: string, now: Date): Promise<OutboxMessageDto> {
    const res = await this.outbox
      .createQueryBuilder()
      .update()
      .set({ status: 'pending', nextAttemptAt: now, attempts: 0 })
      .where(`id = :id AND status = 'failed'`, { id })
      .execute();
    if (res.affected !== 1) {
      const exists = await this.outbox.findOneBy({ id });
      if (!exists) throw new AppException(404, 'not_found', `No message ${id}`);
      throw new AppException(409, 'conflict', `Message ${id} is ${exists.status}; only a failed message can be retried`);
    }
    return toOutboxDto(await this.outbox.findOneByOrFail({ id }));
  }
}
