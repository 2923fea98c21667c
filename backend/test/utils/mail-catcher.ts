import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { ESCORT_SETTINGS, type EscortSettings } from '../../src/escorts/escort.settings';
import { EscortRemindersService } from '../../src/escorts/escort-reminders.service';
import { MailService } from '../../src/mail/mail.service';
import { MAIL_SETTINGS, type MailSettings } from '../../src/mail/mail.settings';
import { createTestApp, type TestApp } from './create-test-app';

export type CaughtMail = {
  to: string[];
  from: string | undefined;
  subject: string;
  text: string;
  messageId: string | undefined;
  attachments: { filename: string | undefined; contentType: string; content: string }[];
};

export type MailCatcher = { port: number; messages: CaughtMail[]; close: () => Promise<void> };

/** An SMTP server in the test process (smtp-server + mailparser) that keeps every message it receives. */
export async function startMailCatcher(port = 0, messages: CaughtMail[] = [], opts: { refuse?: (address: string) => boolean } = {}): Promise<MailCatcher> {
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onRcptTo(address, _session, cb) {
      if (opts.refuse?.(address.address)) {
        const err = new Error('mailbox unavailable') as Error & { responseCode: number };
        err.responseCode = 550;
        return cb(err);
      }
      cb();
    },
    onData(stream, session, cb) {
      simpleParser(stream)
        .then((m) => {
          messages.push({
            to: session.envelope.rcptTo.map((r) => r.address),
            from: m.from?.text,
            subject: m.subject ?? '',
            text: (m.text ?? '').trim(),
            messageId: m.messageId,
            attachments: m.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: a.content.toString('utf8') })),
          });
          cb();
        }, cb);
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(port, '127.0.0.1', () => resolve());
  });
  const actual = (smtp.server.address() as AddressInfo).port;
  return { port: actual, messages, close: () => new Promise<void>((r) => smtp.close(() => r())) };
}

/** A port nothing listens on (an SMTP server that is down). */
export async function freePort(): Promise<number> {
  const c = await startMailCatcher();
  await c.close();
  return c.port;
}

export type MailTestApp = TestApp & { mail: MailService; reminders: EscortRemindersService; channel: string };

let channelCounter = 0;

/**
 * The real AppModule with its own outbox channel and SMTP target, and (unless asked) no schedules: the test calls
 * `mail.sendDue(now)` and `reminders.run(now)` itself, with the clock it wants. Other test apps and the browser-test
 * server send other channels, so they never take this file's mail.
 */
export async function createMailTestApp(
  smtpPort: number,
  channel = `test-${process.pid}-${Date.now().toString(36)}-${channelCounter++}`,
  schedules: { sendIntervalMs?: number; reminderIntervalMs?: number } = {},
): Promise<MailTestApp> {
  const mailSettings: MailSettings = {
    smtpHost: '127.0.0.1',
    smtpPort,
    from: 'Amberline dispatch <dispatch@amberline.example>',
    appUrl: 'http://app.test',
    channel,
    sendIntervalMs: schedules.sendIntervalMs ?? 0,
    maxAttempts: 20,
    baseBackoffMs: 30_000,
    maxBackoffMs: 3_600_000,
    timeoutMs: 2_000,
  };
  const t = await createTestApp((b) =>
    b
      .overrideProvider(MAIL_SETTINGS)
      .useValue(mailSettings)
      .overrideProvider(ESCORT_SETTINGS)
      .useValue({ reminderIntervalMs: schedules.reminderIntervalMs ?? 0 } satisfies EscortSettings),
  );
  return { ...t, mail: t.app.get(MailService), reminders: t.app.get(EscortRemindersService), channel };
}

/** The answer link's token in a caught e-mail. */
export function tokenIn(mail: CaughtMail): string {
  const m = mail.text.match(/\/escort-response\/([A-Za-z0-9_-]{43})/);
  if (!m) throw new Error(`no answer link in "${mail.subject}"`);
  return m[1];
}
