import { SchedulerRegistry } from '@nestjs/schedule';
import type { Role } from '@amberline/common';
import { createTestApp } from './utils/create-test-app';
import { createMailTestApp, freePort, startMailCatcher, type CaughtMail, type MailCatcher, type MailTestApp } from './utils/mail-catcher';

let n = 0;
const address = (tag: string) => `${tag}.${process.pid}.${Date.now().toString(36)}.${n++}@outbox.test.amberline.example`;
const SEC = 1000;

describe('mail outbox', () => {
  describe('with the SMTP server down, then up', () => {
    let t: MailTestApp;
    let port: number;
    let catcher: MailCatcher | null = null;
    beforeAll(async () => {
      port = await freePort();
      t = await createMailTestApp(port);
    });
    afterAll(async () => {
      await t.close();
      await catcher?.close();
    });
    const enqueue = (to: string, extra: Partial<Parameters<MailTestApp['mail']['enqueue']>[1]> = {}) =>
      t.ds.transaction((m) => t.mail.enqueue(m, { to, subject: `Test for ${to}`, text: `Body for ${to}`, ...extra }));
    const rowOf = async (to: string) => (await t.ds.query(`SELECT * FROM mail_outbox WHERE $1 = ANY(to_addresses)`, [to]))[0];

    it('keeps every message, backs off, and sends each exactly once when the server is back', async () => {
      const first = address('first');
      await enqueue(first);
      const t0 = new Date();

      // down: the attempt fails, the message stays pending and waits 30 s, then 60 s
      expect(await t.mail.sendDue(t0)).toEqual({ sent: 0, retrying: 1, failed: 0 });
      let row = await rowOf(first);
      expect(row).toMatchObject({ status: 'pending', attempts: 1, smtp_message_id: null });
      expect(row.last_error).toMatch(/ECONNREFUSED|ECONNECTION/);
      expect(new Date(row.next_attempt_at).getTime()).toBe(t0.getTime() + 30 * SEC);
      expect(await t.mail.sendDue(new Date(t0.getTime() + 10 * SEC))).toEqual({ sent: 0, retrying: 0, failed: 0 });
      const t1 = new Date(t0.getTime() + 31 * SEC);
      expect(await t.mail.sendDue(t1)).toEqual({ sent: 0, retrying: 1, failed: 0 });
      row = await rowOf(first);
      expect(row.attempts).toBe(2);
      expect(new Date(row.next_attempt_at).getTime()).toBe(t1.getTime() + 60 * SEC);

      // more mail arrives while the server is down
      const others = [address('second'), address('third'), address('fourth')];
      for (const to of others) await enqueue(to);
      await t.mail.sendDue(new Date(t0.getTime() + 2 * 60 * SEC));

      // the server comes back on the same port
      catcher = await startMailCatcher(port);
      const later = new Date(t0.getTime() + 10 * 60 * SEC);
      expect(await t.mail.sendDue(later)).toEqual({ sent: 4, retrying: 0, failed: 0 });
      expect(await t.mail.sendDue(new Date(later.getTime() + 3_600 * SEC))).toEqual({ sent: 0, retrying: 0, failed: 0 });
      const got = catcher.messages.map((m) => m.to[0]).sort();
      expect(got).toEqual([first, ...others].sort());
      for (const to of [first, ...others]) {
        const r = await rowOf(to);
        expect(r).toMatchObject({ status: 'sent', last_error: null, smtp_message_id: `<${r.id}@outbox.amberline>` });
        expect(r.smtp_response).toMatch(/^250/);
        expect(catcher.messages.find((m) => m.to[0] === to)?.messageId).toBe(r.smtp_message_id);
      }
    });

    it('a rolled-back change leaves no mail behind', async () => {
      const to = address('rolled-back');
      await expect(
        t.ds.transaction(async (m) => {
          await t.mail.enqueue(m, { to, subject: 'never', text: 'never' });
          throw new Error('the change failed');
        }),
      ).rejects.toThrow('the change failed');
      expect(await rowOf(to)).toBeUndefined();
    });

    it('a dedupe key writes a message once', async () => {
      const to = address('dedupe');
      const key = `test-dedupe:${to}`;
      expect(await enqueue(to, { dedupeKey: key })).toEqual(expect.any(String));
      expect(await enqueue(to, { dedupeKey: key })).toBeNull();
      expect(await t.ds.query(`SELECT count(*)::int AS n FROM mail_outbox WHERE dedupe_key = $1`, [key])).toEqual([{ n: 1 }]);
    });
  });

  describe('several workers on one database', () => {
    let a: MailTestApp;
    let b: MailTestApp;
    let catcher: MailCatcher;
    beforeAll(async () => {
      catcher = await startMailCatcher();
      a = await createMailTestApp(catcher.port);
      // a second server instance sharing the first one's channel
      b = await createMailTestApp(catcher.port, a.channel);
    });
    afterAll(async () => {
      await a.close();
      await b.close();
      await catcher.close();
    });

    it('never send a message twice, even when runs overlap', async () => {
      const recipients = Array.from({ length: 24 }, (_, i) => address(`burst${i}`));
      await a.ds.transaction(async (m) => {
        for (const to of recipients) await a.mail.enqueue(m, { to, subject: `Burst ${to}`, text: 'x' });
      });
      const now = new Date(Date.now() + 1000);
      const reports = await Promise.all([a.mail.sendDue(now), a.mail.sendDue(now), b.mail.sendDue(now), b.mail.sendDue(now)]);
      expect(reports.reduce((s, r) => s + r.sent, 0)).toBe(24);
      expect(reports.filter((r) => r.sent > 0).length).toBeGreaterThan(1); // the work was really shared
      const got = catcher.messages.filter((m: CaughtMail) => recipients.includes(m.to[0])).map((m) => m.to[0]);
      expect(got.sort()).toEqual([...recipients].sort());
    });
  });

  describe('permanent refusals and the admin view', () => {
    let t: MailTestApp;
    let catcher: MailCatcher;
    const tokens = {} as Record<Role, string>;
    beforeAll(async () => {
      catcher = await startMailCatcher(0, [], { refuse: (to) => to.startsWith('refused.') });
      t = await createMailTestApp(catcher.port);
      for (const role of ['admin', 'dispatcher'] as Role[]) tokens[role] = (await t.signedIn({ role })).token;
    });
    afterAll(async () => {
      await t.close();
      await catcher.close();
    });

    it('a 550 marks the message failed at once; the admin sees it and can queue it again', async () => {
      const to = address('refused');
      const id = await t.ds.transaction((m) => t.mail.enqueue(m, { to, subject: 'Refused', text: 'x' }));
      expect(await t.mail.sendDue(new Date())).toMatchObject({ failed: 1 });
      const list = await t.http().get('/api/mail/outbox').query({ status: 'failed', limit: 200 }).set({ authorization: `Bearer ${tokens.admin}` });
      expect(list.status).toBe(200);
      const item = list.body.find((x: { id: string }) => x.id === id);
      expect(item).toMatchObject({ status: 'failed', attempts: 1, to: [to], nextAttemptAt: null });
      expect(item.lastError).toMatch(/550/);
      expect((await t.http().post(`/api/mail/outbox/${id}/retry`).set({ authorization: `Bearer ${tokens.dispatcher}` })).status).toBe(403);
      const retried = await t.http().post(`/api/mail/outbox/${id}/retry`).set({ authorization: `Bearer ${tokens.admin}` });
      expect(retried.status).toBe(201);
      expect(retried.body).toMatchObject({ status: 'pending', attempts: 0 });
      expect((await t.http().post(`/api/mail/outbox/${id}/retry`).set({ authorization: `Bearer ${tokens.admin}` })).status).toBe(409);
      expect((await t.http().get('/api/mail/outbox').query({ status: 'lost' }).set({ authorization: `Bearer ${tokens.admin}` })).body.details[0].field).toBe('status');
    });
  });

  describe('the schedule (@nestjs/schedule)', () => {
    it('is off in a test process unless asked for, so tests own their mail', async () => {
      const t = await createTestApp();
      try {
        expect(t.app.get(SchedulerRegistry).getIntervals()).not.toEqual(expect.arrayContaining(['mail-outbox']));
      } finally {
        await t.close();
      }
    });

    it('when set, the worker sends pending mail by itself', async () => {
      const catcher = await startMailCatcher();
      const t = await createMailTestApp(catcher.port, undefined, { sendIntervalMs: 200, reminderIntervalMs: 60_000 });
      try {
        expect(t.app.get(SchedulerRegistry).getIntervals()).toEqual(expect.arrayContaining(['mail-outbox', 'escort-reminders']));
        const to = address('scheduled');
        await t.ds.transaction((m) => t.mail.enqueue(m, { to, subject: 'Sent by the schedule', text: 'x' }));
        const deadline = Date.now() + 10_000;
        while (!catcher.messages.some((m) => m.to[0] === to) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
        expect(catcher.messages.filter((m) => m.to[0] === to).map((m) => m.subject)).toEqual(['Sent by the schedule']);
      } finally {
        await t.close();
        await catcher.close();
      }
    });
  });
});
