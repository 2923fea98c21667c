import { Injectable } from '@nestjs/common';
import { DataSource, type EntityManager } from 'typeorm';
import type { MailStatus } from '@amberline/common';
import { OutboxMessage, type StoredAttachment } from './entities/outbox-message.entity';

/** A message as the sender takes it from the outbox. */
export type DueMessage = {
  id: string;
  to_addresses: string[];
  subject: string;
  text_body: string;
  html_body: string | null;
  attachments: StoredAttachment[];
  attempts: number;
};

export type NewOutboxRow = {
  channel: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: StoredAttachment[];
  dedupeKey: string | null;
  relatedEntity: string | null;
  relatedId: string | null;
};

/** The mail outbox table: writing, taking what is due (FOR UPDATE SKIP LOCKED), recording each attempt, listing. */
@Injectable()
export class MailRepository {
  constructor(private readonly ds: DataSource) {}

  transaction<T>(fn: (manager: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  /** Writes one message in `manager`'s transaction; its id, or null when a message with its dedupe key exists. */
  async insert(manager: EntityManager, row: NewOutboxRow): Promise<string | null> {
    const rows: { id: string }[] = await manager.query(
      `INSERT INTO mail_outbox (channel, to_addresses, subject, text_body, html_body, attachments, dedupe_key, related_entity, related_id)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)
       ON CONFLICT (dedupe_key) DO NOTHING RETURNING id`,
      [row.channel, row.to, row.subject, row.text, row.html, JSON.stringify(row.attachments), row.dedupeKey, row.relatedEntity, row.relatedId],
    );
    return rows[0]?.id ?? null;
  }

  /** The next pending message of `channel` due at `now`, locked for the transaction (rows another sender holds are skipped). */
  async takeDue(manager: EntityManager, channel: string, now: Date): Promise<DueMessage | null> {
    const rows: DueMessage[] = await manager.query(
      `SELECT id, to_addresses, subject, text_body, html_body, attachments, attempts FROM mail_outbox
       WHERE status = 'pending' AND channel = $1 AND next_attempt_at <= $2
       ORDER BY next_attempt_at, created_at LIMIT 1 FOR UPDATE SKIP LOCKED`,
      [channel, now],
    );
    return rows[0] ?? null;
  }

  async markSent(manager: EntityManager, id: string, at: Date, smtpMessageId: string, smtpResponse: string): Promise<void> {
    await manager.query(
      `UPDATE mail_outbox SET status = 'sent', attempts = attempts + 1, sent_at = $2, smtp_message_id = $3, smtp_response = $4, last_error = NULL WHERE id = $1`,
      [id, at, smtpMessageId, smtpResponse],
    );
  }

  async markAttemptFailed(manager: EntityManager, id: string, status: 'pending' | 'failed', attempts: number, nextAttemptAt: Date, lastError: string): Promise<void> {
    await manager.query(`UPDATE mail_outbox SET status = $2, attempts = $3, next_attempt_at = $4, last_error = $5 WHERE id = $1`, [
      id, status, attempts, nextAttemptAt, lastError,
    ]);
  }

  list(status: MailStatus | undefined, limit: number): Promise<OutboxMessage[]> {
    return this.ds.getRepository(OutboxMessage).find({ where: status ? { status } : {}, order: { createdAt: 'DESC' }, take: limit });
  }

  find(id: string): Promise<OutboxMessage | null> {
    return this.ds.getRepository(OutboxMessage).findOneBy({ id });
  }

  /** Puts a failed message back in the queue, due at `at`; false when it is not (or no longer) failed. */
  async requeueFailed(id: string, at: Date): Promise<boolean> {
    const res = await this.ds
      .getRepository(OutboxMessage)
      .createQueryBuilder()
      .update()
      .set({ status: 'pending', nextAttemptAt: at, attempts: 0 })
      .where(`id = :id AND status = 'failed'`, { id })
      .execute();
    return res.affected === 1;
  }
}
