import { JURISDICTIONS, SAMPLE_RULE_TX, type Role } from '@amberline/common';
import { seedTractor, seedTrailer } from '@amberline/seed';
import { texasMove } from './fixtures/moves';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('/api/rulebook', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  beforeAll(async () => {
    t = await createTestApp();
    for (const [role, u] of Object.entries(await t.signedInAll())) tokens[role as Role] = u.token;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });

  it('holds every one of the 48 contiguous states and DC, each with a current version, source and as-of date', async () => {
    const res = await t.http().get('/api/rulebook/jurisdictions').set(as('dispatcher'));
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(49);
    expect(JURISDICTIONS).toHaveLength(49);
    expect(res.body.map((j: { code: string }) => j.code).sort()).toEqual(JURISDICTIONS.map((j) => j.code).sort());
    for (const j of res.body) {
      expect(j.version).toBeGreaterThanOrEqual(1);
      expect(j.asOf).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    }
    const tx = await t.http().get('/api/rulebook/jurisdictions/TX').set(as('permit_clerk'));
    expect(tx.body.record.legal.source.citation).toMatch(/23 U\.S\.C\. 127/);
    // TxDMV escort table: width over 14 ft (168 in) asks for an escort (references.md §4)
    expect(tx.body.record.escorts.rules.some((r: { when: { measure: string; over?: number } }) => r.when.measure === 'width' && r.when.over === 168)).toBe(true);
  });

  it('an edit creates a new version and keeps the old one; the move assessment records the version it used', async () => {
    const before = (await t.http().get('/api/rulebook/jurisdictions/OK').set(as('admin'))).body;
    const record = { ...before.record, permit: { ...before.record.permit, leadTimeDays: before.record.permit.leadTimeDays + 1 } };
    const res = await t.http().put('/api/rulebook/jurisdictions/OK').set(as('admin')).send({ record, note: 'lead time checked with the state' });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(before.version + 1);
    const versions = (await t.http().get('/api/rulebook/jurisdictions/OK/versions').set(as('dispatcher'))).body;
    expect(versions.map((v: { version: number }) => v.version).slice(0, 2)).toEqual([before.version + 1, before.version]);
    expect(versions[0].note).toBe('lead time checked with the state');
    expect(versions[1].record.permit.leadTimeDays).toBe(before.record.permit.leadTimeDays);
  });

  it('a saved move\'s assessment follows a rule edit at once (results are keyed by rule version, not kept stale)', async () => {
    const tractorId = (await seedTractor(t.ds)).id;
    const trailerId = (await seedTrailer(t.ds)).id;
    const okMove = texasMove(tractorId, trailerId, {
      route: [{ order: 1, jurisdiction: 'OK', roads: 'I-35 N', miles: 120, roadType: 'interstate', zip: '73102' }],
      origin: 'Ardmore, OK', destination: 'Oklahoma City, OK',
    });
    const move = (await t.http().post('/api/moves').set(as('dispatcher')).send(okMove).expect(201)).body;
    const okOf = async () => {
      const a = (await t.http().get(`/api/moves/${move.id}/assessment`).set(as('dispatcher')).expect(200)).body;
      return { version: a.ruleVersions.OK, leadTime: a.result.jurisdictions.find((j: { code: string }) => j.code === 'OK').permit.leadTimeDays };
    };
    const first = await okOf();
    expect(await okOf()).toEqual(first); // asked twice, the same answer
    const current = (await t.http().get('/api/rulebook/jurisdictions/OK').set(as('admin'))).body;
    const record = { ...current.record, permit: { ...current.record.permit, leadTimeDays: current.record.permit.leadTimeDays + 3 } };
    await t.http().put('/api/rulebook/jurisdictions/OK').set(as('admin')).send({ record, note: 'lead time per the state' }).expect(200);
    expect(await okOf()).toEqual({ version: current.version + 1, leadTime: current.record.permit.leadTimeDays + 3 });
  });

  it.each([
    ['dispatcher', 403],
    ['permit_clerk', 403],
    ['driver', 403],
  ] as [Role, number][])('%s may not edit rules (%i)', async (role, status) => {
    const res = await t.http().put('/api/rulebook/jurisdictions/TX').set(as(role)).send({ record: SAMPLE_RULE_TX, note: 'try' });
    expect(res.status).toBe(status);
  });

  it('drivers do not read the rulebook API directly', async () => {
    expect((await t.http().get('/api/rulebook/jurisdictions').set(as('driver'))).status).toBe(403);
  });

  it.each([
    ['a record for another state', (r: Record<string, unknown>) => ({ ...r, code: 'OK' }), 'record.code'],
    ['a negative legal width', (r: Record<string, unknown>) => ({ ...r, legal: { ...(r.legal as object), widthIn: -1 } }), 'record.legal.widthIn'],
    ['a missing travel section', (r: Record<string, unknown>) => ({ ...r, travel: undefined }), 'record.travel'],
  ])('rejects %s with 400 naming the field and keeps the version', async (_l, change, field) => {
    const cur = (await t.http().get('/api/rulebook/jurisdictions/TX').set(as('admin'))).body;
    const res = await t.http().put('/api/rulebook/jurisdictions/TX').set(as('admin')).send({ record: change(cur.record), note: 'bad edit' });
    expect(res.status).toBe(400);
    expect(res.body.details[0].field).toContain(field);
    expect((await t.http().get('/api/rulebook/jurisdictions/TX').set(as('admin'))).body.version).toBe(cur.version);
  });

  it('an unknown jurisdiction is a 404', async () => {
    expect((await t.http().get('/api/rulebook/jurisdictions/ZZ').set(as('admin'))).status).toBe(404);
  });
});
