import { Test } from '@nestjs/testing';
import { DOMAIN_ERRORS, DomainError } from '@amberline/common';
import type { OutboxMessage } from './entities/outbox-message.entity';
import { MailRepository } from './mail.repository';
import { MailService } from './mail.service';
import { MAIL_SETTINGS, type MailSettings } from './mail.settings';

const NOW = new Date('2026-05-04T15:00:00Z');
const settings = { channel: 'unit', from: 'dispatch@amberline.example', appUrl: 'http://desk.example', maxAttempts: 5, baseBackoffMs: 1000, maxBackoffMs: 60_000 } as MailSettings;
const message = (over: Partial<OutboxMessage> = {}) =>
  ({
    id: 'mail-1', toAddresses: ['a@example.com'], subject: 'Hello', status: 'failed', attempts: 5, nextAttemptAt: NOW, lastError: 'EAUTH',
    smtpMessageId: null, sentAt: null, createdAt: new Date('2026-05-01T00:00:00Z'), ...over,
  }) as OutboxMessage;

async function setup(repo: Partial<Record<keyof MailRepository, jest.Mock>>) {
  const mod = await Test.createTestingModule({
    providers: [MailService, { provide: MailRepository, useValue: repo }, { provide: MAIL_SETTINGS, useValue: settings }],
  }).compile();
  return mod.get(MailService);
}

describe('MailService.retry', () => {
  it('puts a failed message back in the queue, due now', async () => {
    const repo = { requeueFailed: jest.fn(async () => true), find: jest.fn(async () => message({ status: 'pending', attempts: 0 })) };
    const dto = await (await setup(repo)).retry('mail-1', NOW);
    expect(repo.requeueFailed).toHaveBeenCalledWith('mail-1', NOW);
    expect(dto).toMatchObject({ id: 'mail-1', status: 'pending', attempts: 0, nextAttemptAt: NOW.toISOString() });
  });

  it.each(['sent', 'pending'] as const)('only a failed message is retried: a %s one is refused', async (status) => {
    const repo = { requeueFailed: jest.fn(async () => false), find: jest.fn(async () => message({ status })) };
    const e = await (await setup(repo)).retry('mail-1', NOW).then(() => null, (x: unknown) => x);
    expect(e).toBeInstanceOf(DomainError);
    expect((e as DomainError).code).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
    expect((e as DomainError).message).toBe(`Message mail-1 is ${status}; only a failed message can be retried`);
  });

  it('an unknown message is not found', async () => {
    const repo = { requeueFailed: jest.fn(async () => false), find: jest.fn(async () => null) };
    await expect((await setup(repo)).retry('mail-9', NOW)).rejects.toMatchObject({ code: DOMAIN_ERRORS.NOT_FOUND, message: 'No message mail-9' });
  });
});

describe('MailService.enqueue', () => {
  it('writes to this instance\'s channel, trims recipients and refuses a message with none', async () => {
    const repo = { insert: jest.fn(async () => 'mail-2') };
    const mail = await setup(repo);
    await expect(mail.enqueue({} as never, { to: [' a@example.com ', ''], subject: 'S'.repeat(400), text: 'body', dedupeKey: 'k-1' })).resolves.toBe('mail-2');
    expect(repo.insert).toHaveBeenCalledWith({}, expect.objectContaining({ channel: 'unit', to: ['a@example.com'], dedupeKey: 'k-1', html: null }));
    expect((repo.insert.mock.calls[0] as unknown[])[1]).toMatchObject({ subject: 'S'.repeat(300) });
    await expect(mail.enqueue({} as never, { to: ['  '], subject: 'S', text: 'body' })).rejects.toThrow('an e-mail needs at least one recipient');
  });
});
