import { createHash } from 'node:crypto';
import type { EscortBookingDto, MoveDto, MoveEscortsDto, Role, RouteSegmentInput } from '@amberline/common';
import { seedTractor, seedTrailer, seedVendor, vendorDefaults } from '@amberline/seed';
import { EscortResponsesService } from '../src/escorts/escort-responses.service';
import { departureInstant } from '../src/escorts/escort-tokens';
import { daysFromNow, texasMove, wideExcavator } from './fixtures/moves';
import { createMailTestApp, startMailCatcher, tokenIn, type MailCatcher, type MailTestApp } from './utils/mail-catcher';

const TX_TWO_LANE: RouteSegmentInput[] = [{ order: 1, jurisdiction: 'TX', roads: 'FM 1960, US 290', miles: 60, roadType: 'two-lane', zip: '77429' }];

describe('escort vendors and bookings (/api/vendors, /api/moves/:id/escort-bookings, /api/escort-responses/:token)', () => {
  let t: MailTestApp;
  let catcher: MailCatcher;
  const tokens = {} as Record<Role, string>;
  const emails = {} as Record<Role, string>;
  let tractorId: string;
  let trailerId: string;

  beforeAll(async () => {
    catcher = await startMailCatcher();
    t = await createMailTestApp(catcher.port);
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) {
      tokens[role] = users[role].token;
      emails[role] = users[role].email;
    }
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(async () => {
    await t.close();
    await catcher.close();
  });

  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });
  const newMove = async (over: Parameters<typeof texasMove>[2] = {}): Promise<MoveDto> => {
    const res = await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, { route: TX_TWO_LANE, ...over }));
    if (res.status !== 201) throw new Error(`move: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  };
  const escortsOf = async (moveId: string, role: Role = 'dispatcher'): Promise<MoveEscortsDto> => (await t.http().get(`/api/moves/${moveId}/escort-bookings`).set(as(role)).expect(200)).body;
  const book = (moveId: string, body: Record<string, unknown>, role: Role = 'dispatcher') =>
    t.http().post(`/api/moves/${moveId}/escort-bookings`).set(as(role)).send({ position: 'lead', seat: 1, jurisdictions: ['TX'], meetingPoint: 'Cypress yard, gate 2', meetingTime: '05:30', ...body });
  const mailTo = (address: string) => catcher.messages.filter((m) => m.to.includes(address.toLowerCase()));
  const flush = () => t.mail.sendDue(new Date());
  /** Books a position and returns the token from the request e-mail the vendor received. */
  const requestAndCatchLink = async (moveId: string, vendor: { id: string; email: string }, body: Record<string, unknown> = {}) => {
    const res = await book(moveId, { vendorId: vendor.id, ...body });
    if (res.status !== 201) throw new Error(`booking: ${res.status} ${JSON.stringify(res.body)}`);
    await flush();
    const mail = mailTo(vendor.email).filter((m) => m.subject.startsWith('Escort request')).pop();
    if (!mail) throw new Error('no request e-mail caught');
    return { booking: res.body as EscortBookingDto, token: tokenIn(mail), mail };
  };
  const confirm = (token: string, over: Record<string, unknown> = {}) =>
    t.http().post(`/api/escort-responses/${token}`).send({ decision: 'confirm', operatorName: 'Rosalind Quade', vehicle: 'White pickup, PLT-0001', phone: '+1 512 555 0142', certifications: [], ...over });
  /** Puts the move straight into permits_received with SQL: the permit module's own guard covers that step, this file tests the next one in isolation. */
  const skipToPermitsReceived = (moveId: string) => t.ds.query(`UPDATE moves SET stage = 'permits_received' WHERE id = $1`, [moveId]);

  describe('vendors', () => {
    it('creates, lists by state and search, and edits a vendor with its operators, insurance, vehicles and rates', async () => {
      const body = vendorDefaults();
      const created = await t.http().post('/api/vendors').set(as('dispatcher')).send(body);
      expect(created.status).toBe(201);
      expect(created.body).toMatchObject({ company: body.company, states: ['TX', 'OK'], rates: { basis: 'per_mile', perMileUsd: 1.95, noGoUsd: 300, layoverUsd: 350 }, warnings: [] });
      expect(created.body.vehicles[0].equipment).toEqual({ heightPole: true, amberLights: true, signs: true, flags: true });
      expect(created.body.operators[0].certifications[0]).toMatchObject({ state: 'OK', expires: '2099-12-31' });
      const list = await t.http().get('/api/vendors').query({ state: 'OK', search: body.company }).set(as('admin'));
      expect(list.body.map((v: { id: string }) => v.id)).toEqual([created.body.id]);
      expect((await t.http().get('/api/vendors').query({ state: 'VA', search: body.company }).set(as('admin'))).body).toEqual([]);

      const { id, version, warnings, createdAt, updatedAt, ...rest } = created.body;
      void warnings; void createdAt; void updatedAt;
      const lapsed = { ...rest, insurance: { ...rest.insurance, expires: '2020-01-31' }, version };
      const upd = await t.http().put(`/api/vendors/${id}`).set(as('admin')).send(lapsed);
      expect(upd.status).toBe(200);
      expect(upd.body.version).toBe(version + 1);
      expect(upd.body.warnings).toEqual(['insurance expired 2020-01-31']);
      const stale = await t.http().put(`/api/vendors/${id}`).set(as('admin')).send({ ...lapsed, phone: '+1 512 555 0199' });
      expect(stale.status).toBe(409);
      expect((await t.http().get(`/api/vendors/${id}`).set(as('dispatcher'))).body.phone).toBe(body.phone);
    });

    it.each([
      ['unknown state', { states: ['ZZ'] }, 'states'],
      ['no state at all', { states: [] }, 'states'],
      ['a state twice', { states: ['TX', 'TX'] }, 'states'],
      ['bad e-mail', { email: 'not-an-address' }, 'email'],
      ['impossible insurance date', { insurance: { liabilityLimitUsd: 1_000_000, expires: '2027-02-30' } }, 'insurance.expires'],
      ['certificate of an unknown state', { operators: [{ name: 'A', certifications: [{ state: 'XX', number: '1', expires: '2030-01-01' }] }] }, 'operators[0].certifications[0].state'],
      ['per-mile basis without a rate', { rates: { basis: 'per_mile' } }, 'rates.perMileUsd'],
      ['negative day rate', { rates: { basis: 'per_day', perDayUsd: -5 } }, 'rates.perDayUsd'],
      ['equipment missing', { vehicles: [{ label: 'Pickup' }] }, 'vehicles[0].equipment'],
    ])('refuses %s with a 400 naming the field', async (_l, over, field) => {
      const res = await t.http().post('/api/vendors').set(as('dispatcher')).send({ ...vendorDefaults(), ...over });
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { field: string }) => d.field)).toContain(field);
    });
  });

  describe('role matrix', () => {
    it.each([
      ['admin', 200, 201, 200, 400, 200],
      ['dispatcher', 200, 201, 200, 400, 403],
      ['permit_clerk', 403, 403, 200, 403, 403],
      ['driver', 403, 403, 403, 403, 403],
    ] as [Role, number, number, number, number, number][])('%s: vendors list %i, create %i; bookings read %i, request %i; outbox %i', async (role, list, create, read, req, outbox) => {
      const move = await newMove();
      expect((await t.http().get('/api/vendors').set(as(role))).status).toBe(list);
      expect((await t.http().post('/api/vendors').set(as(role)).send(vendorDefaults())).status).toBe(create);
      expect((await t.http().get(`/api/moves/${move.id}/escort-bookings`).set(as(role))).status).toBe(read);
      // an empty body: allowed roles get the 400 of validation, the others the 403 of the role check
      expect((await t.http().post(`/api/moves/${move.id}/escort-bookings`).set(as(role)).send({})).status).toBe(req);
      expect((await t.http().get('/api/mail/outbox').set(as(role))).status).toBe(outbox);
    });

    it('needs a token for vendors and bookings, but not for the vendor link', async () => {
      expect((await t.http().get('/api/vendors')).status).toBe(401);
      expect((await t.http().get(`/api/moves/${(await newMove()).id}/escort-bookings`)).status).toBe(401);
      expect((await t.http().get(`/api/escort-responses/${'A'.repeat(43)}`)).status).toBe(404);
    });
  });

  describe('booking by e-mail link', () => {
    it('requests the lead escort, mails the move summary and a link, and the vendor confirms through it', async () => {
      const vendor = await seedVendor(t.ds);
      const move = await newMove();
      const before = await escortsOf(move.id);
      expect(before.needsEscorts).toBe(true);
      // TxDMV: width over 14 ft to 16 ft → 1 front on a two-lane highway (references.md §4)
      expect(before.slots.map((s) => [s.position, s.seat, s.jurisdictions.map((j) => `${j.code}:${j.status}`)])).toEqual([['lead', 1, ['TX:open']]]);

      const res = await book(move.id, { vendorId: vendor.id });
      expect(res.status).toBe(201);
      expect(res.body).toMatchObject({ status: 'requested', position: 'lead', seat: 1, jurisdictions: ['TX'], startDate: move.requestedDeparture, warnings: [] });
      // the e-mail was written in the booking's transaction, and waits in the outbox until the worker runs
      const [queued] = await t.ds.query(`SELECT status, channel FROM mail_outbox WHERE related_id = $1`, [res.body.id]);
      expect(queued).toEqual({ status: 'pending', channel: t.channel });

      expect(await flush()).toMatchObject({ sent: 1, failed: 0 });
      const [mail] = mailTo(vendor.email);
      expect(mail.subject).toBe(`Escort request ${move.reference}: Lead (front), ${move.requestedDeparture}`);
      expect(mail.text).toContain(`Move ${move.reference}: Excavator, Cypress, TX to Fredericksburg, TX`);
      expect(mail.text).toContain('Meeting point: Cypress yard, gate 2 at 05:30 local time');
      expect(mail.text).toMatch(/Load: 15'0?" wide/);
      expect(mail.text).toContain('1. TX FM 1960, US 290 (60 mi, two-lane)');
      expect(mail.text).toMatch(/http:\/\/app\.test\/escort-response\/[A-Za-z0-9_-]{43}/);
      const [sentRow] = await t.ds.query(`SELECT id, status, smtp_message_id FROM mail_outbox WHERE related_id = $1`, [res.body.id]);
      expect(sentRow.status).toBe('sent');
      expect(sentRow.smtp_message_id).toBe(`<${sentRow.id}@outbox.amberline>`);
      expect(mail.messageId).toBe(sentRow.smtp_message_id);

      const token = tokenIn(mail);
      // only the hash is stored
      const stored = await t.ds.query(`SELECT token_hash FROM escort_response_tokens WHERE booking_id = $1`, [res.body.id]);
      expect(stored).toEqual([{ token_hash: createHash('sha256').update(token).digest('hex') }]);
      expect(JSON.stringify(await t.ds.query(`SELECT * FROM escort_bookings WHERE id = $1`, [res.body.id]))).not.toContain(token);

      const view = await t.http().get(`/api/escort-responses/${token}`);
      expect(view.status).toBe(200);
      expect(view.body).toMatchObject({
        position: 'lead', positionLabel: 'Lead (front)', meetingPoint: 'Cypress yard, gate 2', startDate: move.requestedDeparture,
        move: { reference: move.reference, dimensions: { widthIn: 180 } }, vendor: { company: vendor.company },
      });

      const answer = await confirm(token, { certifications: [{ state: 'TX', number: 'TX-NONE-NEEDED' }] });
      expect(answer.status).toBe(200);
      expect(answer.body).toMatchObject({ decision: 'confirm', status: 'confirmed' });

      const after = await escortsOf(move.id);
      expect(after.slots[0]).toMatchObject({ satisfied: true, jurisdictions: [{ code: 'TX', status: 'confirmed', vendor: vendor.company }] });
      expect(after.bookings[0]).toMatchObject({ status: 'confirmed', answer: { operatorName: 'Rosalind Quade', phone: '+1 512 555 0142' }, linkExpiresAt: null });

      await flush();
      const confirmation = mailTo(vendor.email).find((m) => m.subject.startsWith('Confirmed'));
      expect(confirmation).toBeDefined();
      const ics = confirmation!.attachments.find((a) => a.filename === `escort-${move.reference}.ics`);
      expect(ics?.contentType).toBe('text/calendar');
      expect(ics?.content).toContain('BEGIN:VEVENT');
      expect(ics?.content).toContain(`DTSTART;VALUE=DATE:${move.requestedDeparture.replace(/-/g, '')}`);
      expect(ics?.content).toContain('LOCATION:Cypress yard\\, gate 2');
      const notice = mailTo(emails.dispatcher).find((m) => m.subject.startsWith('Confirmed'));
      expect(notice?.text).toContain('Operator Rosalind Quade');

      const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body as { action: string; entity: string }[];
      expect(hist.filter((h) => h.entity === 'escort_booking').map((h) => h.action)).toEqual(['requested', 'answered']);
    });

    it('warns when a state on the booking asks for an escort certificate no operator holds (sample list)', async () => {
      // Virginia 24VAC20-81-180: width over 14 ft on an interstate → 1 front + 1 rear (references.md §4)
      const vendor = await seedVendor(t.ds, { states: ['VA'], operators: [{ name: 'Ilse Marrow', certifications: [] }] });
      const move = await newMove({ route: [{ order: 1, jurisdiction: 'VA', roads: 'I-64 E', miles: 80, roadType: 'interstate', zip: '23219' }], origin: 'Richmond, VA' });
      const slots = (await escortsOf(move.id)).slots.map((s) => `${s.position}:${s.seat}`);
      expect(slots).toEqual(['lead:1', 'chase:1']);
      const res = await book(move.id, { vendorId: vendor.id, jurisdictions: ['VA'], position: 'chase' });
      expect(res.status).toBe(201);
      expect(res.body.warnings).toEqual([expect.stringMatching(/^Virginia asks for an escort certificate and no operator .* holds one \(sample data\)$/)]);
      expect((await escortsOf(move.id)).certificationStates).toEqual(['VA']);
    });

    it.each([
      ['a position the assessment does not ask for', { position: 'chase' }, 'position'],
      ['a second lead seat that is not needed', { seat: 2 }, 'position'],
      ['a state off the slot', { jurisdictions: ['TX', 'OK'] }, 'jurisdictions'],
      ['an unknown state', { jurisdictions: ['ZZ'] }, 'jurisdictions'],
      ['no meeting point', { meetingPoint: '' }, 'meetingPoint'],
      ['a bad meeting time', { meetingTime: '25:00' }, 'meetingTime'],
    ])('refuses %s with a 400 naming the field, and writes no mail', async (_l, over, field) => {
      const vendor = await seedVendor(t.ds);
      const move = await newMove();
      const res = await book(move.id, { vendorId: vendor.id, ...over });
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { field: string }) => d.field)).toContain(field);
      expect((await escortsOf(move.id)).bookings).toEqual([]);
      expect(await t.ds.query(`SELECT 1 FROM mail_outbox WHERE $1 = ANY(to_addresses)`, [vendor.email])).toEqual([]);
    });

    it('refuses a vendor that does not cover the state, an inactive one, and a second booking of a taken position', async () => {
      const move = await newMove();
      const okOnly = await seedVendor(t.ds, { states: ['OK'] });
      const r1 = await book(move.id, { vendorId: okOnly.id });
      expect(r1.status).toBe(400);
      expect(r1.body.details[0]).toEqual({ field: 'vendorId', reason: `${okOnly.company} does not cover TX` });
      const inactive = await seedVendor(t.ds, { active: false });
      expect((await book(move.id, { vendorId: inactive.id })).body.details[0].field).toBe('vendorId');
      const first = await seedVendor(t.ds);
      expect((await book(move.id, { vendorId: first.id })).status).toBe(201);
      const second = await book(move.id, { vendorId: (await seedVendor(t.ds)).id });
      expect(second.status).toBe(409);
      expect(second.body.message).toContain(`already requested with ${first.company}`);
    });

    it('a decline reopens the position, and another vendor can be asked', async () => {
      const a = await seedVendor(t.ds);
      const move = await newMove();
      const { token } = await requestAndCatchLink(move.id, a);
      expect((await t.http().post(`/api/escort-responses/${token}`).send({ decision: 'decline' })).body.details[0].field).toBe('reason');
      const declined = await t.http().post(`/api/escort-responses/${token}`).send({ decision: 'decline', reason: 'Both pole cars are out that week' });
      expect(declined.status).toBe(200);
      expect(declined.body.status).toBe('declined');
      const after = await escortsOf(move.id);
      expect(after.slots[0].jurisdictions[0].status).toBe('open');
      await flush();
      expect(mailTo(emails.dispatcher).some((m) => m.subject.startsWith('Declined') && m.text.includes('Both pole cars are out that week'))).toBe(true);
      const b = await seedVendor(t.ds);
      expect((await book(move.id, { vendorId: b.id })).status).toBe(201);
    });

    it('the dispatcher can call a booking off: the vendor is told and the link stops working', async () => {
      const v = await seedVendor(t.ds);
      const move = await newMove();
      const { booking, token } = await requestAndCatchLink(move.id, v);
      const noReason = await t.http().post(`/api/moves/${move.id}/escort-bookings/${booking.id}/cancel`).set(as('dispatcher')).send({ version: booking.version });
      expect(noReason.status).toBe(400);
      const res = await t.http().post(`/api/moves/${move.id}/escort-bookings/${booking.id}/cancel`).set(as('dispatcher')).send({ version: booking.version, reason: 'customer moved the date' });
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ status: 'cancelled', cancelReason: 'customer moved the date' });
      const link = await confirm(token);
      expect(link.status).toBe(409);
      expect(link.body.details).toEqual({ link: 'closed' });
      await flush();
      expect(mailTo(v.email).some((m) => m.subject.startsWith('Called off'))).toBe(true);
    });
  });

  describe('link tokens', () => {
    it('a replayed link is refused and changes nothing', async () => {
      const v = await seedVendor(t.ds);
      const move = await newMove();
      const { token, booking } = await requestAndCatchLink(move.id, v);
      expect((await confirm(token)).status).toBe(200);
      const replay = await confirm(token, { operatorName: 'Someone Else' });
      expect(replay.status).toBe(409);
      expect(replay.body).toMatchObject({ error: 'conflict', details: { link: 'used' } });
      expect((await t.http().get(`/api/escort-responses/${token}`)).status).toBe(409);
      const now = (await escortsOf(move.id)).bookings.find((b) => b.id === booking.id)!;
      expect(now.answer?.operatorName).toBe('Rosalind Quade');
      expect(now.version).toBe(booking.version + 1);
    });

    it('confirming after declining is refused; the booking stays declined', async () => {
      const v = await seedVendor(t.ds);
      const move = await newMove();
      const { token } = await requestAndCatchLink(move.id, v);
      expect((await t.http().post(`/api/escort-responses/${token}`).send({ decision: 'decline', reason: 'No operator free' })).status).toBe(200);
      const res = await confirm(token);
      expect(res.status).toBe(409);
      expect(res.body.message).toMatch(/already been used/);
      expect((await escortsOf(move.id)).bookings[0]).toMatchObject({ status: 'declined', answer: { decision: 'decline', reason: 'No operator free' } });
    });

    it('an altered, forged or unknown link gets the same answer, which says nothing about the booking', async () => {
      const v = await seedVendor(t.ds);
      const move = await newMove();
      const { token } = await requestAndCatchLink(move.id, v);
      const altered = token.slice(0, 20) + (token[20] === 'A' ? 'B' : 'A') + token.slice(21);
      for (const bad of [altered, token.slice(0, 42), `${token}x`, 'not-a-token', 'A'.repeat(43)]) {
        for (const res of [await t.http().get(`/api/escort-responses/${bad}`), await confirm(bad)]) {
          expect(res.status).toBe(404);
          expect(res.body).toEqual({
            statusCode: 404, error: 'not_found', code: 'not_found', details: { link: 'invalid' },
            message: 'This link is not valid. Check that it was copied whole, or ask the dispatcher who sent it for a new one.',
          });
        }
      }
      expect((await escortsOf(move.id)).bookings[0].status).toBe('requested');
      expect((await t.http().get(`/api/escort-responses/${token}`)).status).toBe(200);
    });

    it('a link expires after 7 days, or at departure when that is sooner, and then tells only that', async () => {
      const v = await seedVendor(t.ds);
      const far = await newMove({ requestedDeparture: daysFromNow(20) });
      const { token } = await requestAndCatchLink(far.id, v);
      const responses = t.app.get(EscortResponsesService);
      // controlled clock: the same link seen 6 days and 7 days + 1 minute from now
      await expect(responses.view(token, new Date(Date.now() + 6 * 86_400_000))).resolves.toMatchObject({ move: { reference: far.reference } });
      await expect(responses.view(token, new Date(Date.now() + 7 * 86_400_000 + 60_000))).rejects.toMatchObject({ code: 'gone', details: { link: 'expired' } });

      const soon = await newMove({ requestedDeparture: daysFromNow(3) });
      const second = await requestAndCatchLink(soon.id, v);
      const [{ expires_at }] = await t.ds.query(`SELECT expires_at FROM escort_response_tokens WHERE booking_id = $1`, [second.booking.id]);
      expect(new Date(expires_at).getTime()).toBe(departureInstant(soon.requestedDeparture, 'America/Chicago').getTime());
      // time passes (the stored expiry moved into the past): the link answers 410 and reveals nothing
      await t.ds.query(`UPDATE escort_response_tokens SET expires_at = now() - interval '1 minute' WHERE booking_id = $1`, [second.booking.id]);
      const res = await confirm(second.token);
      expect(res.status).toBe(410);
      expect(res.body).toEqual({ statusCode: 410, error: 'not_found', code: 'gone', message: 'This link has expired. Ask the dispatcher who sent it for a new one.', details: { link: 'expired' } });
      expect((await escortsOf(soon.id)).bookings[0].status).toBe('requested');
    });

    it('bad answers get a 400 naming the field and leave the link usable', async () => {
      const v = await seedVendor(t.ds);
      const move = await newMove();
      const { token } = await requestAndCatchLink(move.id, v);
      for (const [body, field] of [
        [{ decision: 'confirm', vehicle: 'x', phone: '5125550142' }, 'operatorName'],
        [{ decision: 'confirm', operatorName: 'x', phone: '5125550142' }, 'vehicle'],
        [{ decision: 'confirm', operatorName: 'x', vehicle: 'y', phone: 'call me' }, 'phone'],
        [{ decision: 'maybe' }, 'decision'],
        [{ decision: 'propose', proposedStart: daysFromNow(12) }, 'proposedEnd'],
        [{ decision: 'propose', proposedStart: daysFromNow(12), proposedEnd: daysFromNow(11) }, 'proposedEnd'],
        [{ decision: 'propose', proposedStart: '2027-02-30', proposedEnd: '2027-03-01' }, 'proposedStart'],
        [{ decision: 'propose', proposedStart: daysFromNow(-1), proposedEnd: daysFromNow(1) }, 'proposedStart'],
        [{ decision: 'confirm', operatorName: 'x', vehicle: 'y', phone: '5125550142', extra: 1 }, 'extra'],
      ] as [Record<string, unknown>, string][]) {
        const res = await t.http().post(`/api/escort-responses/${token}`).send(body);
        expect([res.status, res.body.details?.map((d: { field: string }) => d.field)]).toEqual([400, expect.arrayContaining([field])]);
      }
      expect((await escortsOf(move.id)).bookings[0].status).toBe('requested');
      expect((await confirm(token)).status).toBe(200);
    });

    it('proposed dates outside an issued permit\u2019s validity are refused; inside it they are recorded and the position stays open', async () => {
      const v = await seedVendor(t.ds);
      const move = await newMove({ requestedDeparture: daysFromNow(10) });
      const { token } = await requestAndCatchLink(move.id, v);
      // an issued Texas permit valid from departure day 8 to day 14 (written directly: the permit desk is another module)
      await t.ds.query(
        `INSERT INTO permits (move_id, jurisdiction, status, valid_from, valid_to) VALUES ($1, 'TX', 'issued', $2, $3)
         ON CONFLICT (move_id, jurisdiction) WHERE status <> 'void' DO UPDATE SET status = 'issued', valid_from = $2, valid_to = $3`,
        [move.id, `${daysFromNow(8)}T06:00:00Z`, `${daysFromNow(14)}T05:59:00Z`],
      );
      const outside = await t.http().post(`/api/escort-responses/${token}`).send({ decision: 'propose', proposedStart: daysFromNow(13), proposedEnd: daysFromNow(15) });
      expect(outside.status).toBe(400);
      expect(outside.body.details[0]).toEqual({ field: 'proposedEnd', reason: `the Texas permit for this move is valid ${daysFromNow(8)} to ${daysFromNow(13)}; propose dates inside it, or call the dispatcher` });
      expect((await escortsOf(move.id)).bookings[0].status).toBe('requested');
      const inside = await t.http().post(`/api/escort-responses/${token}`).send({ decision: 'propose', proposedStart: daysFromNow(11), proposedEnd: daysFromNow(11), note: 'Free from the 11th' });
      expect(inside.status).toBe(200);
      const after = await escortsOf(move.id);
      expect(after.bookings[0]).toMatchObject({ status: 'proposed', answer: { proposedStart: daysFromNow(11), note: 'Free from the 11th' } });
      expect(after.slots[0]).toMatchObject({ satisfied: false, jurisdictions: [{ status: 'proposed' }] });
    });
  });

  describe('the escorts_booked guard', () => {
    it('refuses while a required position is unconfirmed (409 listing it), passes once the vendor confirms', async () => {
      const v = await seedVendor(t.ds);
      const move = await newMove();
      await skipToPermitsReceived(move.id);
      const refused = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'escorts_booked' });
      expect(refused.status).toBe(409);
      expect(refused.body.details.unmet).toEqual([{ code: 'escort_unconfirmed', jurisdiction: 'TX', message: 'Lead (front) escort in Texas: not booked' }]);
      const { token } = await requestAndCatchLink(move.id, v);
      const waiting = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'escorts_booked' });
      expect(waiting.body.details.unmet[0].message).toBe('Lead (front) escort in Texas: awaiting the vendor\u2019s answer');
      expect((await confirm(token)).status).toBe(200);
      const ok = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'escorts_booked' });
      expect(ok.status).toBe(201);
      expect(ok.body.stage).toBe('escorts_booked');
      const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body as { action: string; after: { notes?: string[] } }[];
      expect(hist.find((h) => h.action === 'stage')?.after.notes).toEqual([`Lead (front) confirmed: TX by ${v.company}`]);
    });

    it('a move that needs no escort passes, with that reason in its history', async () => {
      // an 8 ft 6 in wide load is within the legal width (23 CFR 658.15): no permit, no escort
      const move = await newMove({ articles: [wideExcavator({ widthIn: 96 })] });
      expect((await escortsOf(move.id)).needsEscorts).toBe(false);
      await skipToPermitsReceived(move.id);
      const ok = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'escorts_booked' });
      expect(ok.status).toBe(201);
      expect(ok.body.stage).toBe('escorts_booked');
      const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body as { action: string; after: { notes?: string[] } }[];
      expect(hist.find((h) => h.action === 'stage')?.after.notes).toEqual([expect.stringMatching(/^no escort needed: the assessment asks for no escort in Texas \(rulebook v\d+\)$/)]);
    });

    it('escorts not on file for a state stay an open question until the issued permit’s escort condition is recorded', async () => {
      // Georgia's record has its escort rules not on file: a 15 ft wide load there asks the permit, never "no escort"
      const move = await newMove({ route: [{ order: 1, jurisdiction: 'GA', roads: 'US 341', miles: 90, roadType: 'two-lane', zip: '31015' }], origin: 'Cordele, GA', destination: 'Perry, GA' });
      expect((await escortsOf(move.id)).escortsNotOnFile).toEqual(['GA']);
      expect((await t.http().post(`/api/moves/${move.id}/permits/sync`).set(as('permit_clerk'))).status).toBe(200);
      const [permit] = (await t.http().get(`/api/moves/${move.id}/permits`).set(as('permit_clerk'))).body;
      // the permit is not pre-filled with 0 escorts
      expect(permit.conditions).toEqual({ escortsKnown: false });
      await t.ds.query(`UPDATE permits SET status = 'issued' WHERE id = $1`, [permit.id]);
      await skipToPermitsReceived(move.id);
      const refused = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'escorts_booked' });
      expect(refused.status).toBe(409);
      expect(refused.body.details.unmet).toEqual([
        { code: 'escorts_not_on_file', jurisdiction: 'GA', message: 'GA escorts: not on file in the rulebook — record the escorts the issued permit asks (front and rear, 0 if none)' },
      ]);
      const current = (await t.http().get(`/api/permits/${permit.id}`).set(as('permit_clerk'))).body;
      const recorded = await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: current.version, conditions: { escortsFront: 0, escortsRear: 0 } });
      expect(recorded.status).toBe(200);
      const ok = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'escorts_booked' });
      expect(ok.status).toBe(201);
      const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body as { action: string; after: { notes?: string[] } }[];
      // the permit's recorded escorts govern Georgia now: the note names the permit, not the rulebook
      expect(hist.find((h) => h.action === 'stage')?.after.notes).toEqual([expect.stringMatching(/^no escort needed: the issued permit asks none in Georgia \(GA permit .+\)$/)]);
    });

    it('a plan change that raises the requirement, or moves the dates, shows as unmet again', async () => {
      const v = await seedVendor(t.ds);
      let move = await newMove();
      const { token } = await requestAndCatchLink(move.id, v);
      expect((await confirm(token)).status).toBe(200);
      // TxDMV: over 16 ft wide → front and rear escorts on all roads
      const wider = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, articles: [wideExcavator({ widthIn: 204 })] });
      expect(wider.status).toBe(200);
      move = wider.body;
      const slots = (await escortsOf(move.id)).slots;
      expect(slots.map((s) => `${s.position}:${s.jurisdictions[0].status}`)).toEqual(['lead:confirmed', 'chase:open']);
      await skipToPermitsReceived(move.id);
      const refused = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'escorts_booked' });
      expect(refused.status).toBe(409);
      expect(refused.body.details.unmet.map((u: { message: string }) => u.message)).toEqual(['Chase (rear) escort in Texas: not booked']);
      const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body as { action: string; after: { unmet?: string[] } }[];
      expect(hist.find((h) => h.action === 'escorts_unmet')?.after.unmet).toEqual(['Chase (rear) in Texas: not booked']);

      const later = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version + 0, requestedDeparture: daysFromNow(12) });
      expect(later.status).toBe(200);
      expect((await escortsOf(move.id)).slots[0].jurisdictions[0].status).toBe('open');
    });
  });
});
