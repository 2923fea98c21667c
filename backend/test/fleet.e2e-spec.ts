import type { Role } from '@amberline/common';
import { STEP_DECK_DEFAULTS, TRACTOR_DEFAULTS } from '@amberline/seed';
import { createTestApp, type TestApp } from './utils/create-test-app';

let n = 0;
const unit = (p: string) => `${p}-${process.pid}-${Date.now().toString(36)}-${n++}`;

describe('/api/fleet', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  beforeAll(async () => {
    t = await createTestApp();
    for (const [role, u] of Object.entries(await t.signedInAll())) tokens[role as Role] = u.token;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });
  const tractorBody = (over = {}) => ({ unitNumber: unit('T'), plate: 'AMB123', ...TRACTOR_DEFAULTS, ...over });
  const trailerBody = (over = {}) => ({ unitNumber: unit('S'), ...STEP_DECK_DEFAULTS, ...over });

  it.each([
    ['admin', 201, 201, 200],
    ['dispatcher', 403, 403, 200],
    ['permit_clerk', 403, 403, 200],
    ['driver', 403, 403, 403],
  ] as [Role, number, number, number][])('%s: create tractor %i, create trailer %i, list %i', async (role, tr, tl, list) => {
    expect((await t.http().post('/api/fleet/tractors').set(as(role)).send(tractorBody())).status).toBe(tr);
    expect((await t.http().post('/api/fleet/trailers').set(as(role)).send(trailerBody())).status).toBe(tl);
    expect((await t.http().get('/api/fleet/trailers').set(as(role))).status).toBe(list);
    expect((await t.http().get('/api/fleet/tractors').set(as(role))).status).toBe(list);
  });

  it('keeps a trailer with its decks, anchor ratings and gauge calibration, and audits edits', async () => {
    const created = await t.http().post('/api/fleet/trailers').set(as('admin')).send(trailerBody());
    expect(created.status).toBe(201);
    expect(created.body.decks).toHaveLength(2);
    expect(created.body.anchorPoints).toContainEqual({ kind: 'winch_track', countPerSide: 12, wllLb: 6600 });
    const upd = await t.http().put(`/api/fleet/trailers/${created.body.id}`).query({ version: created.body.version }).set(as('admin')).send(trailerBody({ unitNumber: created.body.unitNumber, tareLb: 15000 }));
    expect(upd.status).toBe(200);
    expect(upd.body.tareLb).toBe(15000);
    const stale = await t.http().put(`/api/fleet/trailers/${created.body.id}`).query({ version: created.body.version }).set(as('admin')).send(trailerBody({ unitNumber: created.body.unitNumber, tareLb: 16000 }));
    expect(stale.status).toBe(409);
    const [row] = await t.ds.query(`SELECT count(*)::int AS n FROM audit_entries WHERE entity = 'trailer' AND entity_id = $1`, [created.body.id]);
    expect(row.n).toBe(2);
  });

  it.each([
    ['a deck ending behind the trailer', { decks: [{ name: 'deck', fromFrontIn: 0, toFrontIn: 700, heightIn: 60 }] }, 'decks[0].toFrontIn'],
    ['a deck with no length', { decks: [{ name: 'deck', fromFrontIn: 100, toFrontIn: 100, heightIn: 60 }] }, 'decks[0].toFrontIn'],
    ['a slider setting outside its range', { axleGroupFromKingpinFt: 45 }, 'axleGroupFromKingpinFt'],
    ['an unknown trailer type', { type: 'hovercraft' }, 'type'],
    ['a negative anchor rating', { anchorPoints: [{ kind: 'stake_pocket', countPerSide: 10, wllLb: -1 }] }, 'anchorPoints[0].wllLb'],
    ['two gauge readings at one pressure', { gaugeCalibration: [{ psi: 20, loadLb: 12000 }, { psi: 20, loadLb: 14000 }] }, 'gaugeCalibration'],
  ])('rejects %s with 400 naming the field', async (_l, over, field) => {
    const res = await t.http().post('/api/fleet/trailers').set(as('admin')).send(trailerBody(over));
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('refuses a second unit with the same number', async () => {
    const body = tractorBody();
    expect((await t.http().post('/api/fleet/tractors').set(as('admin')).send(body)).status).toBe(201);
    const dup = await t.http().post('/api/fleet/tractors').set(as('admin')).send(body);
    expect(dup.status).toBe(409);
    expect(dup.body.details[0].field).toBe('unitNumber');
  });
});
