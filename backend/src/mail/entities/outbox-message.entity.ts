import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { MailStatus } from '@amberline/common';

export type StoredAttachment = { filename: string; contentType: string; contentBase64: string };

/** One e-mail, written in the transaction of the change that causes it and sent later by the outbox worker. */
@Entity({ name: 'mail_outbox' })
export class OutboxMessage {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 80 }) channel: string;
  @Column({ name: 'to_addresses', type: 'varchar', length: 254, array: true }) toAddresses: string[];
  @Column({ type: 'varchar', length: 300 }) subject: string;
  @Column({ name: 'text_body', type: 'text' }) textBody: string;
  @Column({ name: 'html_body', type: 'text', nullable: true }) htmlBody: string | null;
  @Column({ type: 'jsonb', default: () => `'[]'::jsonb` }) attachments: StoredAttachment[];
  @Column({ name: 'dedupe_key', type: 'varchar', length: 200, nullable: true }) dedupeKey: string | null;
  @Column({ name: 'related_entity', type: 'varchar', length: 40, nullable: true }) relatedEntity: string | null;
  @Column({ name: 'related_id', type: 'uuid', nullable: true }) relatedId: string | null;
  @Column({ type: 'varchar', length: 10, default: 'pending' }) status: MailStatus;
  @Column({ type: 'int', default: 0 }) attempts: number;
  @Column({ name: 'next_attempt_at', type: 'timestamptz' }) nextAttemptAt: Date;
  @Column({ name: 'last_error', type: 'text', nullable: true }) lastError: string | null;
  @Column({ name: 'smtp_message_id', type: 'varchar', length: 300, nullable: true }) smtpMessageId: string | null;
  @Column({ name: 'smtp_response', type: 'text', nullable: true }) smtpResponse: string | null;
  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true }) sentAt: Date | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
