import type { EscortBookingDto, MoveDto, Role } from '@amberline/common';
import { seedTractor, seedTrailer, seedUser, seedVendor } from '@amberline/seed';
import { daysFromNow, texasMove } from './fixtures/moves';
import { createMailTestApp, startMailCatcher, tokenIn, type MailCatcher, type MailTestApp } from './utils/mail-catcher';

const HOUR = 3_600_000;

/** Reminders run with a controlled clock: the test passes `now` to the same method the schedule calls. */
describe('escort reminders', () => {
  let t: MailTestApp;
  let catcher: MailCatcher;
  let dispatcher: { token: string; email: string };
  let tractorId: string;
  let trailerId: string;
  beforeAll(async () => {
    catcher = await startMailCatcher();
    t = await createMailTestApp(catcher.port);
    dispatcher = await t.signedIn({ role: 'dispatcher' as Role });
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(async () => {
    await t.close();
    await catcher.close();
  });
  const as = () => ({ authorization: `Bearer ${dispatcher.token}` });
  const newMove = async (over = {}): Promise<MoveDto> =>
    (
      await t
        .http()
        .post('/api/moves')
        .set(as())
        .send(texasMove(tractorId, trailerId, { route: [{ order: 1, jurisdiction: 'TX', roads: 'FM 1960', miles: 60, roadType: 'two-lane', zip: '77429' }], ...over }))
        .expect(201)
    ).body;
  const book = async (move: MoveDto, vendorId: string): Promise<EscortBookingDto> =>
    (
      await t.http().post(`/api/moves/${move.id}/escort-bookings`).set(as()).send({ vendorId, position: 'lead', seat: 1, jurisdictions: ['TX'], meetingPoint: 'Cypress yard', meetingTime: '06:00' }).expect(201)
    ).body;
  const mailTo = (a: string) => catcher.messages.filter((m) => m.to.includes(a));

  it('a request unanswered after 24 h gets one reminder with a new link, and the dispatcher one notice', async () => {
    const vendor = await seedVendor(t.ds);
    const move = await newMove();
    const booking = await book(move, vendor.id);
    const requestedAt = Date.parse(booking.requestedAt);
    await t.mail.sendDue(new Date(requestedAt + 1000));
    const firstLink = tokenIn(mailTo(vendor.email)[0]);

    expect(await t.reminders.run(new Date(requestedAt + 23 * HOUR), [move.id])).toEqual({ unanswered: 0, departure: 0 });
    expect(await t.reminders.run(new Date(requestedAt + 25 * HOUR), [move.id])).toEqual({ unanswered: 1, departure: 0 });
    expect(await t.reminders.run(new Date(requestedAt + 49 * HOUR), [move.id])).toEqual({ unanswered: 0, departure: 0 });
    await t.mail.sendDue(new Date(requestedAt + 25 * HOUR));

    const reminders = mailTo(vendor.email).filter((m) => m.subject.startsWith('Reminder'));
    expect(reminders).toHaveLength(1);
    expect(reminders[0].subject).toBe(`Reminder: escort request ${move.reference} awaits your answer`);
    const newLink = tokenIn(reminders[0]);
    expect(newLink).not.toBe(firstLink);
    const notices = mailTo(dispatcher.email).filter((m) => m.subject.startsWith('No answer yet'));
    expect(notices).toHaveLength(1);
    expect(notices[0].text).toContain('in 24 hours');

    // either link answers; one answer spends both
    expect((await t.http().get(`/api/escort-responses/${firstLink}`)).status).toBe(200);
    const ok = await t.http().post(`/api/escort-responses/${newLink}`).send({ decision: 'confirm', operatorName: 'Tobin Hallet', vehicle: 'Silver pickup', phone: '512 555 0177' });
    expect(ok.status).toBe(200);
    expect((await t.http().get(`/api/escort-responses/${firstLink}`)).body.details).toEqual({ link: 'used' });
    const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as())).body as { action: string }[];
    expect(hist.filter((h) => h.action === 'reminded')).toHaveLength(1);
  });

  it('the day before departure, a confirmed escort gets the run details once, with the calendar file', async () => {
    const vendor = await seedVendor(t.ds);
    const driver = await seedUser(t.ds, { role: 'driver', name: 'Wendell Okafor' });
    const departure = daysFromNow(9);
    const move = await newMove({ requestedDeparture: departure, driverId: driver.id });
    await book(move, vendor.id);
    await t.mail.sendDue(new Date());
    const link = tokenIn(mailTo(vendor.email)[0]);
    await t.http().post(`/api/escort-responses/${link}`).send({ decision: 'confirm', operatorName: 'Rosalind Quade', vehicle: 'White pickup', phone: '512 555 0142' }).expect(200);

    // noon in Texas two days before, the day before, and on the day of departure
    const at = (daysBefore: number) => new Date(Date.parse(`${departure}T18:00:00Z`) - daysBefore * 24 * HOUR);
    expect(await t.reminders.run(at(2), [move.id])).toEqual({ unanswered: 0, departure: 0 });
    expect(await t.reminders.run(at(1), [move.id])).toEqual({ unanswered: 0, departure: 1 });
    expect(await t.reminders.run(at(0), [move.id])).toEqual({ unanswered: 0, departure: 0 });
    await t.mail.sendDue(at(1));

    const tomorrow = mailTo(vendor.email).filter((m) => m.subject.startsWith('Tomorrow'));
    expect(tomorrow).toHaveLength(1);
    expect(tomorrow[0].subject).toBe(`Tomorrow: escort ${move.reference}, meet at Cypress yard`);
    expect(tomorrow[0].text).toContain('Meeting point: Cypress yard at 06:00 local time');
    expect(tomorrow[0].text).toContain('Your operator: Rosalind Quade, 512 555 0142; vehicle White pickup');
    expect(tomorrow[0].text).toContain('Driver of the load: Wendell Okafor');
    expect(tomorrow[0].attachments[0]).toMatchObject({ contentType: 'text/calendar' });
    expect(tomorrow[0].attachments[0].content).toContain(`DTSTART;VALUE=DATE:${departure.replace(/-/g, '')}`);
  });

  it('a declined or called-off request gets no reminder', async () => {
    const vendor = await seedVendor(t.ds);
    const move = await newMove();
    const booking = await book(move, vendor.id);
    await t.http().post(`/api/moves/${move.id}/escort-bookings/${booking.id}/cancel`).set(as()).send({ version: booking.version, reason: 'load not ready' }).expect(200);
    expect(await t.reminders.run(new Date(Date.parse(booking.requestedAt) + 30 * HOUR), [move.id])).toEqual({ unanswered: 0, departure: 0 });
  });
});
