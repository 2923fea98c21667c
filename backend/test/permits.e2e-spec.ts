import type { MoveDto, PermitDto, PermitSummaryDto, Role } from '@amberline/common';
import { seedTractor, seedTrailer, seedUser } from '@amberline/seed';
import { seedPermit } from '@amberline/seed';
import { ExpiryScanService } from '../src/permits/expiry-scan.service';
import { daysFromNow, texasMove, wideExcavator } from './fixtures/moves';
import { texasNewMexicoMove, validity } from './fixtures/permits';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('/api/permits', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  const ids = {} as Record<Role, string>;
  let tractorId: string;
  let trailerId: string;
  beforeAll(async () => {
    t = await createTestApp();
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) {
      tokens[role] = users[role].token;
      ids[role] = users[role].id;
    }
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });

  const newMove = async (over = {}, twoStates = false): Promise<MoveDto> => {
    const body = twoStates ? texasNewMexicoMove(tractorId, trailerId, over) : texasMove(tractorId, trailerId, over);
    const res = await t.http().post('/api/moves').set(as('dispatcher')).send(body);
    expect(res.status).toBe(201);
    return res.body;
  };
  const sync = async (moveId: string, role: Role = 'permit_clerk') => t.http().post(`/api/moves/${moveId}/permits/sync`).set(as(role));
  const permitsOf = async (moveId: string): Promise<PermitDto[]> => (await t.http().get(`/api/moves/${moveId}/permits`).set(as('permit_clerk'))).body;
  const patch = (id: string, body: object, role: Role = 'permit_clerk') => t.http().patch(`/api/permits/${id}`).set(as(role)).send(body);
  /** Files and issues a permit valid over the move's travel days. */
  const issue = async (p: PermitDto, departureInDays = 10, days = 5): Promise<PermitDto> => {
    const filed = await patch(p.id, { version: p.version, status: 'filed' });
    expect(filed.status).toBe(200);
    const issued = await patch(p.id, { version: filed.body.version, status: 'issued', permitNumber: `TX-${Date.now()}`, ...validity(departureInDays, days), actualFeeUsd: 210 });
    expect(issued.status).toBe(200);
    return issued.body;
  };

  it('creates one permit per jurisdiction that needs one from the assessment, once, and audits it', async () => {
    const move = await newMove({}, true);
    const res = await sync(move.id);
    expect(res.status).toBe(200);
    expect(res.body.created).toBe(2);
    expect(res.body.permits.map((p: PermitSummaryDto) => p.jurisdiction).sort()).toEqual(['NM', 'TX']);
    const again = await sync(move.id);
    expect(again.body).toMatchObject({ created: 0, updated: 0 });

    const assessment = (await t.http().get(`/api/moves/${move.id}/assessment`).set(as('permit_clerk'))).body;
    const txFeeOf = assessment.result.jurisdictions.find((j: { code: string }) => j.code === 'TX').fee;
    const txFee = txFeeOf.known ? txFeeOf.totalUsd : null;
    const txRefundable = txFeeOf.known ? txFeeOf.refundable : null;
    const [nm, tx] = await permitsOf(move.id);
    expect(tx).toMatchObject({ jurisdiction: 'TX', status: 'to_file', estimatedFeeUsd: txFee, timeZone: 'America/Chicago', refundable: txRefundable, needed: true, moveReference: move.reference });
    expect(tx.conditions.escortsFront).toBeGreaterThanOrEqual(0);
    expect(tx.routeText).toContain('I-10 W');
    expect(nm).toMatchObject({ jurisdiction: 'NM', timeZone: 'America/Denver' });
    // file-by = departure minus the state's lead time
    expect(tx.fileBy).toBe(daysFromNow(10 - (tx.leadTimeDays ?? 0)));
    expect(tx.history).toHaveLength(1);
    const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body;
    expect(hist.filter((h: { entity: string; action: string }) => h.entity === 'permit' && h.action === 'created')).toHaveLength(2);
  });

  it('takes a permit from to_file through filed to issued, copying the plan at filing and reading validity in the state\'s zone', async () => {
    const move = await newMove();
    await sync(move.id);
    const [p] = await permitsOf(move.id);
    const skip = await patch(p.id, { version: p.version, status: 'issued' });
    expect(skip.status).toBe(409);
    expect(skip.body.message).toMatch(/cannot go from To file to Issued/);

    const filed = await patch(p.id, { version: p.version, status: 'filed', routeText: 'FM 1960, US 290, I-10 W', conditions: { escortsFront: 1, travelHours: '30 min before sunrise to 30 min after sunset', maxSpeedMph: 45, utilityContacts: ['Line crew on call 555-0100'] } });
    expect(filed.status).toBe(200);
    expect(filed.body.status).toBe('filed');
    expect(filed.body.filedAt).toBeTruthy();
    // 23 CFR 658.15: cargo counts toward width — the 180 in excavator is the permitted width
    expect(filed.body.permitted).toMatchObject({ widthIn: 180, planRevision: 1 });
    expect(filed.body.permitted.grossLb).toBeGreaterThan(80_000);
    expect(filed.body.conditions.maxSpeedMph).toBe(45);

    const noNumber = await patch(p.id, { version: filed.body.version, status: 'issued', ...validity(10, 5) });
    expect(noNumber.status).toBe(400);
    expect(noNumber.body.details).toEqual([{ field: 'permitNumber', reason: expect.stringMatching(/permit number/) }]);

    const v = validity(10, 5);
    const issued = await patch(p.id, { version: filed.body.version, status: 'issued', permitNumber: 'TX 2026-55871', ...v, actualFeeUsd: 210.5 });
    expect(issued.status).toBe(200);
    expect(issued.body).toMatchObject({ status: 'issued', permitNumber: 'TX 2026-55871', actualFeeUsd: 210.5, validFromLocal: v.validFrom, validToLocal: v.validTo, urgency: 'settled' });
    // Texas is on Central time: local midnight is 05:00 or 06:00 UTC depending on daylight saving time
    expect(issued.body.validFrom).toMatch(/T0[56]:00:00\.000Z$/);
    expect(issued.body.history.map((h: { status: string }) => h.status)).toEqual(['issued', 'filed', 'to_file']);
    const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body;
    const issuedEntry = hist.find((h: { entity: string; action: string }) => h.entity === 'permit' && h.action === 'issued');
    expect(issuedEntry).toMatchObject({ before: { status: 'filed', permitNumber: null }, after: { status: 'issued', permitNumber: 'TX 2026-55871' } });
  });

  describe('bad input', () => {
    let p: PermitDto;
    beforeAll(async () => {
      const move = await newMove();
      await sync(move.id);
      [p] = await permitsOf(move.id);
    });
    it.each([
      ['a fee of 0', { actualFeeUsd: 0 }, 'actualFeeUsd'],
      ['a negative fee', { actualFeeUsd: -25 }, 'actualFeeUsd'],
      ['a fee with fractions of a cent', { actualFeeUsd: 10.005 }, 'actualFeeUsd'],
      ['validity not a local date-time', { validFrom: '2026-13-40' }, 'validFrom'],
      ['an impossible date', { validFrom: '2026-02-30T10:00' }, 'validFrom'],
      ['an unknown status', { status: 'approved' }, 'status'],
      ['a speed over 80 mph', { conditions: { maxSpeedMph: 95 } }, 'conditions.maxSpeedMph'],
      ['a permit number with a path in it', { permitNumber: '../../x' }, 'permitNumber'],
      ['a driver as assignee', { assigneeId: 'driver' }, 'assigneeId'],
      ['rejecting without a reason', { status: 'void' }, 'reason'],
    ])('%s → 400 naming %s', async (_name, body, field) => {
      const b = { ...body } as Record<string, unknown>;
      if (b.assigneeId === 'driver') b.assigneeId = ids.driver;
      const res = await patch(p.id, { version: p.version, ...b });
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body)).toContain(field.split('.').pop());
      const now = (await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body;
      expect(now.version).toBe(p.version); // nothing changed
    });
    it('a validity that ends before it starts → 400 naming validTo', async () => {
      const res = await patch(p.id, { version: p.version, validFrom: `${daysFromNow(9)}T00:00`, validTo: `${daysFromNow(8)}T00:00` });
      expect(res.status).toBe(400);
      expect(res.body.details[0].field).toBe('validTo');
    });
    it('a stale version → 409 and nothing changed', async () => {
      const ok = await patch(p.id, { version: p.version, notes: 'called the state desk' });
      expect(ok.status).toBe(200);
      const stale = await patch(p.id, { version: p.version, notes: 'overwrite' });
      expect(stale.status).toBe(409);
      expect((await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body.notes).toBe('called the state desk');
      p = ok.body;
    });
  });

  it('flags an issued permit for amendment when the plan grows, with the history kept; a smaller load needs none', async () => {
    const move = await newMove();
    await sync(move.id);
    const [p] = await permitsOf(move.id);
    const issued = await issue(p);
    // narrower load: still within the permitted figures
    const narrower = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, articles: [wideExcavator({ widthIn: 170 })] });
    expect(narrower.status).toBe(200);
    expect((await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body.status).toBe('issued');
    // wider load: over the permitted 15 ft
    const wider = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: narrower.body.version, articles: [wideExcavator({ widthIn: 192 })] });
    expect(wider.status).toBe(200);
    const flagged: PermitDto = (await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body;
    expect(flagged.status).toBe('needs_amendment');
    expect(flagged.amendmentReason).toMatch(/width 15'0" permitted, now 16'0"/);
    expect(flagged.permitNumber).toBe(issued.permitNumber);
    expect(flagged.history[0]).toMatchObject({ status: 'needs_amendment', reason: expect.stringMatching(/plan changed \(articles\)/) });
    expect(flagged.history[1].status).toBe('issued');
    const overview = (await t.http().get('/api/permits/overview').set(as('permit_clerk'))).body;
    expect(overview.needsAmendment.map((x: PermitSummaryDto) => x.id)).toContain(p.id);
    // the amendment is filed with the new figures, then issued again
    const refiled = await patch(p.id, { version: flagged.version, status: 'filed' });
    expect(refiled.body.permitted.widthIn).toBe(192);
    const hist = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body;
    expect(hist.some((h: { entity: string; action: string }) => h.entity === 'permit' && h.action === 'flagged_for_amendment')).toBe(true);
  });

  it('flags the permit when a date change leaves the travel days outside its validity', async () => {
    const move = await newMove();
    await sync(move.id);
    const [p] = await permitsOf(move.id);
    await issue(p, 10, 3);
    const res = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, requestedDeparture: daysFromNow(20) });
    expect(res.status).toBe(200);
    const after: PermitDto = (await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body;
    expect(after.status).toBe('needs_amendment');
    expect(after.amendmentReason).toMatch(/validity no longer covers the planned travel: travel (window|day) \d{4}-\d\d-\d\d .*lies outside the permit's validity/);
  });

  it('the guard lists what is missing, permit by permit, and refuses a validity that misses a travel day', async () => {
    const move = await newMove({}, true);
    const none = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'permits_received' });
    expect(none.status).toBe(409);
    expect(none.body.details.unmet).toEqual(expect.arrayContaining([
      expect.objectContaining({ code: 'permit_missing', jurisdiction: 'TX' }),
      expect.objectContaining({ code: 'permit_missing', jurisdiction: 'NM' }),
    ]));
    await sync(move.id);
    const [nm, tx] = await permitsOf(move.id);
    // Texas issued for one day only; the move travels two days
    const filed = await patch(tx.id, { version: tx.version, status: 'filed' });
    await patch(tx.id, { version: filed.body.version, status: 'issued', permitNumber: 'TX-1', validFrom: `${daysFromNow(10)}T00:00`, validTo: `${daysFromNow(10)}T23:59` });
    const res = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'permits_received' });
    expect(res.status).toBe(409);
    const unmet = res.body.details.unmet as { code: string; jurisdiction: string; message: string }[];
    const of = (j: string) => unmet.filter((u) => u.jurisdiction === j).map((u) => u.code).sort();
    expect(of('TX')).toEqual(['permit_pdf_missing', 'permit_unpaid', 'permit_validity']);
    expect(of('NM')).toEqual(['permit_not_issued', 'permit_pdf_missing', 'permit_unpaid']);
    expect(unmet.find((u) => u.code === 'permit_validity')!.message).toMatch(new RegExp(`^TX permit: valid ${daysFromNow(10)} 00:00 C[SD]T to ${daysFromNow(10)} 23:59 C[SD]T: travel (window|day) ${daysFromNow(11)} .*lies outside the permit's validity`));
    expect(res.body.message).toMatch(/NM permit: is to file, not issued/);
    expect(nm.status).toBe('to_file');
    expect((await t.http().get(`/api/moves/${move.id}`).set(as('dispatcher'))).body.stage).toBe('requested');
  });

  it('queue: filters, sorting, server-side paging, urgency, counters and bulk assignment', async () => {
    const clerk = await seedUser(t.ds, { role: 'permit_clerk' });
    const soon = await newMove({ requestedDeparture: daysFromNow(2), customer: 'Queue Soon Haulage' });
    const later = await newMove({ requestedDeparture: daysFromNow(25), customer: 'Queue Later Haulage' });
    await sync(soon.id);
    await sync(later.id);
    const [ps] = await permitsOf(soon.id);
    const [pl] = await permitsOf(later.id);
    expect(['overdue', 'due_soon']).toContain(ps.urgency);
    expect(pl.urgency).toBe('upcoming');

    const assign = await t.http().post('/api/permits/assign').set(as('permit_clerk')).send({ permitIds: [ps.id, pl.id], assigneeId: clerk.id });
    expect(assign.status).toBe(200);
    expect(assign.body.updated).toBe(2);
    const mine = await t.http().get('/api/permits').query({ assignee: clerk.id, sort: 'urgency', pageSize: 1 }).set(as('permit_clerk'));
    expect(mine.status).toBe(200);
    expect(mine.body.total).toBe(2);
    expect(mine.body.items.map((x: PermitSummaryDto) => x.id)).toEqual([ps.id]);
    const page2 = await t.http().get('/api/permits').query({ assignee: clerk.id, sort: 'urgency', pageSize: 1, page: 2 }).set(as('permit_clerk'));
    expect(page2.body.items.map((x: PermitSummaryDto) => x.id)).toEqual([pl.id]);
    const desc = await t.http().get('/api/permits').query({ assignee: clerk.id, sort: '-departure' }).set(as('dispatcher'));
    expect(desc.body.items.map((x: PermitSummaryDto) => x.id)).toEqual([pl.id, ps.id]);
    expect(desc.body.items[0].assignee).toEqual({ id: clerk.id, name: clerk.name });
    const filtered = await t.http().get('/api/permits').query({ assignee: clerk.id, status: 'filed', jurisdiction: 'TX' }).set(as('admin'));
    expect(filtered.body.total).toBe(0);
    const mineAsMe = await t.http().get('/api/permits').query({ assignee: 'me' }).set(as('permit_clerk'));
    expect(mineAsMe.body.items.every((x: PermitSummaryDto) => x.assignee?.id === ids.permit_clerk)).toBe(true);

    const overview = (await t.http().get('/api/permits/overview').set(as('dispatcher'))).body;
    expect(overview.counts.to_file).toBeGreaterThanOrEqual(2);
    expect(Object.keys(overview.counts).sort()).toEqual(['filed', 'issued', 'needs_amendment', 'rejected', 'to_file', 'void']);

    const toDriver = await t.http().post('/api/permits/assign').set(as('permit_clerk')).send({ permitIds: [ps.id], assigneeId: ids.driver });
    expect(toDriver.status).toBe(400);
    expect(toDriver.body.details[0].field).toBe('assigneeId');
    const unknown = await t.http().post('/api/permits/assign').set(as('permit_clerk')).send({ permitIds: ['7d4c8d4e-1111-4a4a-8888-000000000000'], assigneeId: null });
    expect(unknown.status).toBe(400);
    expect((await t.http().get('/api/permits').query({ sort: 'sideways' }).set(as('admin'))).status).toBe(400);
    expect((await t.http().get('/api/permits').query({ pageSize: 1000 }).set(as('admin'))).status).toBe(400);
    expect((await t.http().get('/api/permits').query({ status: 'opened' }).set(as('admin'))).body.details[0].field).toBe('status');

    // the desk's default view, open: an issued permit (state set directly here) leaves it but stays under "any status"
    await t.ds.query(`UPDATE permits SET status = 'issued' WHERE id = $1`, [pl.id]);
    const open = await t.http().get('/api/permits').query({ assignee: clerk.id, status: 'open' }).set(as('permit_clerk'));
    expect(open.body.items.map((x: PermitSummaryDto) => x.id)).toEqual([ps.id]);
    expect(open.body.total).toBe(1);
    const any = await t.http().get('/api/permits').query({ assignee: clerk.id }).set(as('permit_clerk'));
    expect(any.body.items.map((x: PermitSummaryDto) => x.id)).toEqual([ps.id, pl.id]);
  });

  describe('role matrix', () => {
    let move: MoveDto;
    let p: PermitDto;
    beforeAll(async () => {
      move = await newMove({ driverId: ids.driver });
      await sync(move.id);
      [p] = await permitsOf(move.id);
    });
    it.each([
      ['admin', 200, 200, 200, 200],
      ['dispatcher', 200, 403, 200, 200],
      ['permit_clerk', 200, 200, 200, 200],
      ['driver', 403, 403, 403, 200],
    ] as [Role, number, number, number, number][])('%s: queue %i, edit %i, create from assessment %i, read own move\'s permit %i', async (role, q, e, s, r) => {
      expect((await t.http().get('/api/permits').set(as(role))).status).toBe(q);
      const cur = (await t.http().get(`/api/permits/${p.id}`).set(as('admin'))).body;
      expect((await patch(p.id, { version: cur.version, notes: `note by ${role}` }, role)).status).toBe(e);
      expect((await sync(move.id, role)).status).toBe(s);
      expect((await t.http().get(`/api/permits/${p.id}`).set(as(role))).status).toBe(r);
    });
    it('a driver does not see the permits of a move not assigned to them; nobody without a token does', async () => {
      const other = await newMove();
      await sync(other.id);
      const [op] = await permitsOf(other.id);
      expect((await t.http().get(`/api/permits/${op.id}`).set(as('driver'))).status).toBe(404);
      expect((await t.http().get(`/api/moves/${other.id}/permits`).set(as('driver'))).status).toBe(404);
      expect((await t.http().get(`/api/moves/${move.id}/permits`).set(as('driver'))).status).toBe(200);
      expect((await t.http().get('/api/permits')).status).toBe(401);
      expect((await t.http().post('/api/permits/assign').set(as('dispatcher')).send({ permitIds: [op.id], assigneeId: null })).status).toBe(403);
    });
  });

  it('voids the open permits of a cancelled move in the same transaction, with the reason in their history', async () => {
    const move = await newMove();
    await sync(move.id);
    expect((await permitsOf(move.id)).map((p) => p.status)).toEqual(['to_file']);
    await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'cancelled', reason: 'customer postponed' }).expect(201);
    const after = await permitsOf(move.id);
    expect(after.map((p) => p.status)).toEqual(['void']);
    expect(after[0].history[0]).toMatchObject({ status: 'void', reason: 'the move was cancelled' });
  });

  it('keeps the queue order current: a new departure moves the file-by date of the move\'s permits', async () => {
    const move = await newMove({ requestedDeparture: daysFromNow(12) });
    await sync(move.id);
    const before: { departure: string; file_by: string; lead_time_days: number }[] = await t.ds.query(
      `SELECT to_char(departure, 'YYYY-MM-DD') AS departure, to_char(file_by, 'YYYY-MM-DD') AS file_by, lead_time_days FROM permits WHERE move_id = $1`, [move.id]);
    expect(before[0].departure).toBe(daysFromNow(12));
    const cur = (await t.http().get(`/api/moves/${move.id}`).set(as('dispatcher'))).body;
    await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: cur.version, requestedDeparture: daysFromNow(20) }).expect(200);
    const after: { departure: string; file_by: string; lead_time_days: number }[] = await t.ds.query(
      `SELECT to_char(departure, 'YYYY-MM-DD') AS departure, to_char(file_by, 'YYYY-MM-DD') AS file_by, lead_time_days FROM permits WHERE move_id = $1`, [move.id]);
    expect(after[0].departure).toBe(daysFromNow(20));
    expect(after[0].file_by).toBe(new Date(Date.parse(`${daysFromNow(20)}T00:00:00Z`) - after[0].lead_time_days * 86_400_000).toISOString().slice(0, 10));
  });

  describe('daily expiry scan', () => {
    it('flags a permit expiring before the planned exit, and one within 48 hours of a controlled clock; clears a flag that no longer applies', async () => {
      const scan = t.app.get(ExpiryScanService);
      const move = await newMove({ requestedDeparture: daysFromNow(10), travelDays: 2 });
      const shortOne = await seedPermit(t.ds, {
        moveId: move.id, jurisdiction: 'TX', status: 'issued',
        // valid until noon (Central) on the first travel day: the move is still in Texas the day after
        validFrom: `${daysFromNow(9)}T06:00:00Z`, validTo: `${daysFromNow(10)}T17:00:00Z`,
      });
      const move2 = await newMove({ requestedDeparture: daysFromNow(3), travelDays: 1 });
      const longOne = await seedPermit(t.ds, { moveId: move2.id, jurisdiction: 'TX', status: 'issued', validFrom: `${daysFromNow(2)}T06:00:00Z`, validTo: `${daysFromNow(5)}T06:00:00Z` });

      const first = await scan.scan(new Date());
      expect(first.ran).toBe(true);
      const warn = async (id: string) => (await t.http().get(`/api/permits/${id}`).set(as('permit_clerk'))).body.expiryWarning as string | null;
      expect(await warn(shortOne.id)).toMatch(/before the planned exit at the end of/);
      expect(await warn(longOne.id)).toBeNull();
      expect(first.flagged.map((f) => f.permitId)).toContain(shortOne.id);
      // the warning is e-mailed through the outbox, written in the scan's transaction, to the clerks and the dispatcher
      const mails = await t.ds.query(`SELECT to_addresses, subject FROM mail_outbox WHERE related_entity = 'permit' AND related_id = $1`, [shortOne.id]);
      expect(mails).toHaveLength(1);
      expect(mails[0].subject).toMatch(/Permit warning: .* TX .*before the planned exit/);

      // two days later on the clock, the long permit is within 48 hours of its end
      const later = new Date(Date.now() + 3.5 * 86_400_000);
      await scan.scan(later);
      expect(await warn(longOne.id)).toMatch(/expires within 48 hours/);
      // back to today: the 48-hour warning no longer applies and is cleared, with an audit entry
      await scan.scan(new Date());
      expect(await warn(longOne.id)).toBeNull();
      const hist = (await t.http().get(`/api/moves/${move2.id}/history`).set(as('dispatcher'))).body;
      expect(hist.map((h: { action: string }) => h.action)).toEqual(expect.arrayContaining(['expiry_flagged', 'expiry_cleared']));
      const overview = (await t.http().get('/api/permits/overview').set(as('permit_clerk'))).body;
      expect(overview.expiringSoon.map((x: PermitSummaryDto) => x.id)).toContain(shortOne.id);
    });

    it('runs on one server at a time: a scan while another holds the lock skips', async () => {
      const scan = t.app.get(ExpiryScanService);
      const qr = t.ds.createQueryRunner();
      await qr.connect();
      await qr.startTransaction();
      try {
        await qr.query(`SELECT pg_advisory_xact_lock(hashtext('amberline.permits.expiry-scan'))`);
        const skipped = await scan.scan(new Date());
        expect(skipped).toEqual({ ran: false, checked: 0, flagged: [] });
      } finally {
        await qr.rollbackTransaction();
        await qr.release();
      }
      expect((await scan.scan(new Date())).ran).toBe(true);
    });
  });
});
