import type { Role } from '@amberline/common';
import { seedTractor, seedTrailer, seedUser } from '@amberline/seed';
import { daysFromNow, texasMove, wideExcavator } from './fixtures/moves';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('/api/moves', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  let tractorId: string;
  let trailerId: string;
  let driverId: string;
  beforeAll(async () => {
    t = await createTestApp();
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) {
      tokens[role] = users[role].token;
    }
    driverId = users.driver.id;
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });
  const create = (over = {}, role: Role = 'dispatcher') => t.http().post('/api/moves').set(as(role)).send(texasMove(tractorId, trailerId, over));

  it('creates a move, stores the route with points, and audits the creation', async () => {
    const res = await create({ driverId });
    expect(res.status).toBe(201);
    expect(res.body.reference).toMatch(/^AM-\d{4}-\d{5}$/);
    expect(res.body.stage).toBe('requested');
    expect(res.body.route[0]).toMatchObject({ jurisdiction: 'TX', timeZone: 'America/Chicago', place: expect.stringContaining('TX 77429') });
    expect(res.body.driver).toMatchObject({ id: driverId });
    const hist = await t.http().get(`/api/moves/${res.body.id}/history`).set(as('dispatcher'));
    expect(hist.body).toHaveLength(1);
    expect(hist.body[0]).toMatchObject({ action: 'created', entity: 'move', actor: { name: expect.any(String) } });
    expect(hist.body[0].after.commodity).toBe('Excavator');
  });

  it('assesses the Texas move: permit for width, one front escort on the two-lane road (TxDMV, width over 14 ft)', async () => {
    const m = (await create()).body;
    const res = await t.http().get(`/api/moves/${m.id}/assessment`).set(as('permit_clerk'));
    expect(res.status).toBe(200);
    const tx = res.body.result.jurisdictions.find((j: { code: string }) => j.code === 'TX');
    expect(tx.permitRequired).toBe(true);
    expect(tx.permitReasons.map((r: { code: string }) => r.code)).toEqual(expect.arrayContaining([expect.stringMatching(/width/)]));
    // TxDMV "Escort and Equipment Requirements": width over 14 ft to 16 ft -> 1 front on a two-lane highway
    expect(tx.escorts.front).toBeGreaterThanOrEqual(1);
    expect(res.body.ruleVersions.TX).toBeGreaterThanOrEqual(1);
    expect(res.body.caution).toMatch(/permit/i);
    // overall width is the load's 180 in (23 CFR 658.15: cargo counts toward width)
    expect(res.body.result.dimensions.widthIn).toBe(180);
  });

  it('lists moves with paging, stage filter and search; counts per stage', async () => {
    const name = `Searchable Bluffs Gravel ${Date.now().toString(36)}${process.pid}`;
    const m = (await create({ customer: name })).body;
    const res = await t.http().get('/api/moves').query({ search: name, stage: 'requested' }).set(as('permit_clerk'));
    expect(res.status).toBe(200);
    expect(res.body.items.map((x: { id: string }) => x.id)).toEqual([m.id]);
    expect(res.body.items[0].flags.permitsNeeded).toBe(1);
    const counts = await t.http().get('/api/moves/stage-counts').set(as('dispatcher'));
    expect(counts.body.requested).toBeGreaterThanOrEqual(1);
  });

  describe('role matrix', () => {
    it.each([
      ['admin', 201, 200, 200, 200],
      ['dispatcher', 201, 200, 200, 200],
      ['permit_clerk', 403, 403, 200, 200],
      ['driver', 403, 403, 404, 404],
    ] as [Role, number, number, number, number][])('%s: create %i, edit %i, read %i, assessment %i', async (role, c, e, r, a) => {
      expect((await create({}, role)).status).toBe(c);
      const m = (await create()).body;
      expect((await t.http().patch(`/api/moves/${m.id}`).set(as(role)).send({ version: m.version, notes: 'x' })).status).toBe(e);
      expect((await t.http().get(`/api/moves/${m.id}`).set(as(role))).status).toBe(r);
      expect((await t.http().get(`/api/moves/${m.id}/assessment`).set(as(role))).status).toBe(a);
    });

    it('a driver sees the moves assigned to them and nothing else', async () => {
      const mine = (await create({ driverId })).body;
      const other = (await create()).body;
      expect((await t.http().get(`/api/moves/${mine.id}`).set(as('driver'))).status).toBe(200);
      expect((await t.http().get(`/api/moves/${other.id}`).set(as('driver'))).status).toBe(404);
      const list = await t.http().get('/api/moves').query({ pageSize: 100 }).set(as('driver'));
      expect(list.body.items.every((x: { driver: { id: string } | null }) => x.driver?.id === driverId)).toBe(true);
      expect((await t.http().post(`/api/moves/${mine.id}/stage`).set(as('driver')).send({ to: 'cancelled', reason: 'x' })).status).toBe(403);
    });

    it('refuses callers without a token', async () => {
      expect((await t.http().get('/api/moves')).status).toBe(401);
    });
  });

  describe('bad input gets a 400 naming the field', () => {
    it.each([
      ['zero width', { articles: [wideExcavator({ widthIn: 0 })] }, 'articles[0].widthIn'],
      ['negative length', { articles: [wideExcavator({ lengthIn: -5 })] }, 'articles[0].lengthIn'],
      ['absurd height', { articles: [wideExcavator({ heightIn: 5000 })] }, 'articles[0].heightIn'],
      ['weight over 1,000,000 lb', { articles: [wideExcavator({ weightLb: 1_000_001 })] }, 'articles[0].weightLb'],
      ['unknown jurisdiction', { route: [{ order: 1, jurisdiction: 'ZZ', roads: 'x', miles: 10, roadType: 'interstate' }] }, 'route[0].jurisdiction'],
      ['Alaska is not on the contiguous network', { route: [{ order: 1, jurisdiction: 'AK', roads: 'x', miles: 10, roadType: 'interstate' }] }, 'route[0].jurisdiction'],
      ['repeated segment order', { route: [{ order: 1, jurisdiction: 'TX', roads: 'a', miles: 10, roadType: 'interstate' }, { order: 1, jurisdiction: 'TX', roads: 'b', miles: 10, roadType: 'interstate' }] }, 'route'],
      ['missing segment order', { route: [{ order: 1, jurisdiction: 'TX', roads: 'a', miles: 10, roadType: 'interstate' }, { order: 3, jurisdiction: 'TX', roads: 'b', miles: 10, roadType: 'interstate' }] }, 'route'],
      ['ZIP in another state', { route: [{ order: 1, jurisdiction: 'TX', roads: 'a', miles: 10, roadType: 'interstate', zip: '23219' }] }, 'route[0].zip'],
      ['departure in the past', { requestedDeparture: daysFromNow(-3) }, 'requestedDeparture'],
      ['slider outside the range', { sliderSettingFt: 50 }, 'sliderSettingFt'],
      ['trailer that does not exist', { trailerId: '6f1c7c1e-93a4-4d38-9d0a-3c1b1c1f0a11' }, 'trailerId'],
      ['driver that does not exist', { driverId: '6f1c7c1e-93a4-4d38-9d0a-3c1b1c1f0a11' }, 'driverId'],
      ['anchor the trailer lacks', { articles: [wideExcavator({ tiedowns: [{ kind: 'chain', chainSize: '3/8', chainGrade: 70, anchorKind: 'd_ring', path: 'direct' }] })] }, 'articles[0].tiedowns[0].anchorKind'],
    ])('%s', async (_label, over, field) => {
      const res = await create(over);
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { field: string }) => d.field)).toContain(field);
    });

    it('a dispatcher id for driverId is refused', async () => {
      const d = await seedUser(t.ds, { role: 'dispatcher' });
      const res = await create({ driverId: d.id });
      expect(res.status).toBe(400);
      expect(res.body.details[0].field).toBe('driverId');
    });
  });

  describe('editing', () => {
    it('a stale edit gets 409 and changes nothing', async () => {
      const m = (await create()).body;
      const first = await t.http().patch(`/api/moves/${m.id}`).set(as('dispatcher')).send({ version: m.version, notes: 'first' });
      expect(first.status).toBe(200);
      expect(first.body.version).toBe(m.version + 1);
      const stale = await t.http().patch(`/api/moves/${m.id}`).set(as('dispatcher')).send({ version: m.version, notes: 'second' });
      expect(stale.status).toBe(409);
      const now = await t.http().get(`/api/moves/${m.id}`).set(as('dispatcher'));
      expect(now.body.notes).toBe('first');
    });

    it('audits an edit with the changed fields only, before and after', async () => {
      const m = (await create()).body;
      await t.http().patch(`/api/moves/${m.id}`).set(as('dispatcher')).send({ version: m.version, sliderSettingFt: 36, commodity: 'Excavator with bucket' }).expect(200);
      const hist = (await t.http().get(`/api/moves/${m.id}/history`).set(as('dispatcher'))).body;
      const upd = hist.find((h: { action: string }) => h.action === 'updated');
      expect(upd.before).toEqual({ commodity: 'Excavator', sliderSettingFt: 39 });
      expect(upd.after).toEqual({ commodity: 'Excavator with bucket', sliderSettingFt: 36 });
    });
  });

  describe('workflow', () => {
    it('refuses a step that is not in the workflow with 409 listing why', async () => {
      const m = (await create()).body;
      const res = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'running' });
      expect(res.status).toBe(409);
      expect(res.body.details.unmet[0].code).toBe('not_a_step');
    });

    it('cancels with a reason (and not without one), then refuses any further step', async () => {
      const m = (await create()).body;
      const noReason = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'cancelled' });
      expect(noReason.status).toBe(400);
      expect(noReason.body.details[0].field).toBe('reason');
      const ok = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'cancelled', reason: 'customer postponed' });
      expect(ok.status).toBe(201);
      expect(ok.body.stage).toBe('cancelled');
      const again = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'requested' });
      expect(again.status).toBe(409);
      const hist = (await t.http().get(`/api/moves/${m.id}/history`).set(as('dispatcher'))).body;
      expect(hist.at(-1)).toMatchObject({ action: 'stage', before: { stage: 'requested' }, after: { stage: 'cancelled' }, reason: 'customer postponed' });
    });

    it('refuses to run a move whose securement falls short or that has no driver, listing both', async () => {
      const short = wideExcavator({ tiedowns: [{ kind: 'chain', chainSize: '3/8', chainGrade: 70, anchorKind: 'stake_pocket', path: 'direct' }] });
      const m = (await create({ articles: [short] })).body;
      // earlier stages are guarded by the permit and escort checks; this test starts at escorts_booked
      await t.ds.query(`UPDATE moves SET stage = 'escorts_booked' WHERE id = $1`, [m.id]);
      const res = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'running' });
      expect(res.status).toBe(409);
      const codes = res.body.details.unmet.map((u: { code: string }) => u.code);
      expect(codes).toEqual(expect.arrayContaining(['driver_missing', 'securement_short']));
      expect(res.body.message).toMatch(/securement of A1 falls short/);
    });

    it('two simultaneous transitions: exactly one wins, the other gets 409', async () => {
      const m = (await create()).body;
      const [a, b] = await Promise.all([
        t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'cancelled', reason: 'one' }),
        t.http().post(`/api/moves/${m.id}/stage`).set(as('admin')).send({ to: 'cancelled', reason: 'two' }),
      ]);
      expect([a.status, b.status].sort()).toEqual([201, 409]);
      const stages = (await t.http().get(`/api/moves/${m.id}/history`).set(as('dispatcher'))).body.filter((h: { action: string }) => h.action === 'stage');
      expect(stages).toHaveLength(1);
    });
  });
});
