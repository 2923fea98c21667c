import { JURISDICTIONS, RULEBOOK_DATA, type Role } from '@amberline/common';

const leadTime = (days: number) => ({
  status: 'sourced', value: days, citation: 'test: lead time per the state', url: 'https://example.org/test', edition: 'test', asOf: '2026-12-02',
});
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
    // version 1 of each is its data file, as shipped
    const ga = await t.http().get('/api/rulebook/jurisdictions/GA').set(as('permit_clerk'));
    expect(ga.body.record).toEqual(RULEBOOK_DATA.GA);
    expect(ga.body.record.schema).toBe(2);
  });

  it('coverage: jurisdictions × topics, each cell sourced / secondary / partial / unknown, with counts and the oldest as-of date', async () => {
    const res = await t.http().get('/api/rulebook/coverage').set(as('dispatcher'));
    expect(res.status).toBe(200);
    expect(res.body.rows).toHaveLength(49);
    expect(res.body.topics.map((x: { key: string }) => x.key)).toEqual(expect.arrayContaining(['escorts', 'fee', 'travel.hours']));
    const t0 = res.body.totals;
    expect(t0.sourced + t0.secondary + t0.unknown).toBe(t0.facts);
    expect(t0.facts).toBe(49 * 36);
    for (const r of res.body.rows) for (const c of r.cells) expect(['sourced', 'secondary', 'partial', 'unknown']).toContain(c.status);
    expect((await t.http().get('/api/rulebook/coverage').set(as('driver'))).status).toBe(403);
  });

  it('an edit creates a new version and keeps the old one; the move assessment records the version it used', async () => {
    const before = (await t.http().get('/api/rulebook/jurisdictions/OK').set(as('admin'))).body;
    const record = { ...before.record, permit: { ...before.record.permit, leadTimeDays: leadTime(4) } };
    const res = await t.http().put('/api/rulebook/jurisdictions/OK').set(as('admin')).send({ record, note: 'lead time checked with the state' });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(before.version + 1);
    const versions = (await t.http().get('/api/rulebook/jurisdictions/OK/versions').set(as('dispatcher'))).body;
    expect(versions.map((v: { version: number }) => v.version).slice(0, 2)).toEqual([before.version + 1, before.version]);
    expect(versions[0].note).toBe('lead time checked with the state');
    expect(versions[1].record.permit.leadTimeDays).toEqual(before.record.permit.leadTimeDays);
    expect(versions[0].record.permit.leadTimeDays.value).toBe(4);
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
    const next = (current.record.permit.leadTimeDays.value ?? 0) + 3;
    const record = { ...current.record, permit: { ...current.record.permit, leadTimeDays: leadTime(next) } };
    await t.http().put('/api/rulebook/jurisdictions/OK').set(as('admin')).send({ record, note: 'lead time per the state' }).expect(200);
    expect(await okOf()).toEqual({ version: current.version + 1, leadTime: next });
  });

  it.each([
    ['dispatcher', 403],
    ['permit_clerk', 403],
    ['driver', 403],
  ] as [Role, number][])('%s may not edit rules (%i)', async (role, status) => {
    const res = await t.http().put('/api/rulebook/jurisdictions/TX').set(as(role)).send({ record: RULEBOOK_DATA.TX, note: 'try' });
    expect(res.status).toBe(status);
  });

  it('drivers do not read the rulebook API directly', async () => {
    expect((await t.http().get('/api/rulebook/jurisdictions').set(as('driver'))).status).toBe(403);
  });

  it.each([
    ['a record for another state', (r: Record<string, unknown>) => ({ ...r, code: 'OK' }), 'record.code'],
    ['a negative legal width', (r: any) => ({ ...r, legal: { ...r.legal, widthIn: { ...leadTime(-1) } } }), 'record.legal.widthIn.value'],
    ['a missing travel section', (r: any) => ({ ...r, travel: undefined }), 'record.travel'],
    ['a value with no source', (r: any) => ({ ...r, fee: { status: 'sourced', value: { baseUsd: 60 } } }), 'record.fee.citation'],
    ['an unknown status with a value', (r: any) => ({ ...r, legal: { ...r.legal, heightIn: { status: 'unknown', note: 'not read', value: 168 } } }), 'record.legal.heightIn.value'],
    ['an absurd limit', (r: any) => ({ ...r, legal: { ...r.legal, grossLb: { ...leadTime(8_000_000) } } }), 'record.legal.grossLb.value'],
    [
      'a curfew with no area',
      (r: any) => ({ ...r, travel: { ...r.travel, curfews: { ...leadTime(0), value: [{ start: '07:00', end: '09:00', appliesIn: 'urban' }] } } }),
      'record.travel.curfews.value[0].area',
    ],
    [
      'an unknown holiday name',
      (r: any) => ({ ...r, travel: { ...r.travel, holidays: { ...leadTime(0), value: { names: ['arbor-day'], from: 'day-only', observance: 'actual' } } } }),
      'record.travel.holidays.value.names[0]',
    ],
    ['an impossible calendar date', (r: any) => ({ ...r, asOf: '2026-02-30' }), 'record.asOf'],
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
