import { seedTractor, seedTrailer, vendorDefaults, seedVendor } from '@amberline/seed';
import { texasMove } from './fixtures/moves';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('fuzz', () => {
  let t: TestApp;
  const tok: Record<string, string> = {};
  let tractorId: string, trailerId: string;
  beforeAll(async () => {
    t = await createTestApp();
    const u = await t.signedInAll();
    for (const k of Object.keys(u)) tok[k] = (u as any)[k].token;
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(() => t.close());
  const as = (r: string) => ({ authorization: `Bearer ${tok[r]}` });
  const VALUES: unknown[] = [null, [], [[]], 'x', 1e20, -1, {}, 1e-7, true, '2026-02-30', '\u0000'];
  const bad: string[] = [];
  const check = async (label: string, p: Promise<any>) => { const r = await p; if (r.status >= 500) bad.push(`${label} -> ${r.status}`); };
  const flatten = (o: any, prefix = ''): [string, unknown][] => Object.entries(o).flatMap(([k, v]) => {
    const p = prefix ? `${prefix}.${k}` : k;
    if (v && typeof v === 'object' && !Array.isArray(v)) return [[p, v], ...flatten(v, p)];
    if (Array.isArray(v) && v[0] && typeof v[0] === 'object') return [[p, v], ...flatten(v[0], `${p}.0`)];
    return [[p, v]];
  });
  const setPath = (o: any, path: string, v: unknown) => { const c = JSON.parse(JSON.stringify(o)); const ks = path.split('.'); let x = c; for (const k of ks.slice(0, -1)) x = x[k]; x[ks[ks.length - 1]] = v; return c; };
  it('fuzzes', async () => {
    jest.setTimeout(600000);
    const move = texasMove(tractorId, trailerId);
    for (const [p] of flatten(move)) for (const v of VALUES) await check(`POST move ${p}=${JSON.stringify(v)}`, t.http().post('/api/moves/preview').set(as('dispatcher')).send(setPath(move, p, v)));
    const m = (await t.http().post('/api/moves').set(as('dispatcher')).send(move)).body;
    for (const [p] of flatten(move)) for (const v of VALUES) {
      const cur = (await t.http().get(`/api/moves/${m.id}`).set(as('dispatcher'))).body;
      const top = p.split('.')[0];
      const body = setPath({ [top]: (move as any)[top] }, p, v);
      await check(`PATCH move ${p}=${JSON.stringify(v)}`, t.http().patch(`/api/moves/${m.id}`).set(as('dispatcher')).send({ version: cur.version, ...body }));
    }
    const vendor = vendorDefaults();
    for (const [p] of flatten(vendor)) for (const v of VALUES) await check(`POST vendor ${p}=${JSON.stringify(v)}`, t.http().post('/api/vendors').set(as('dispatcher')).send(setPath({ ...vendorDefaults() }, p, v)));
    await t.http().post(`/api/moves/${m.id}/permits/sync`).set(as('permit_clerk'));
    const [permit] = (await t.http().get(`/api/moves/${m.id}/permits`).set(as('permit_clerk'))).body;
    const pbody = { permitType: 'single_trip', permitNumber: 'TX-1', issuedAt: '2026-12-01T00:00:00Z', validFrom: '2026-12-20T00:00', validTo: '2026-12-25T00:00', routeText: 'r', conditions: { escortsFront: 1, travelHours: 'x', utilityContacts: ['a'] }, conditionsText: 'c', actualFeeUsd: 10, notes: 'n', reason: 'why', status: 'filed' };
    for (const [p] of flatten(pbody)) for (const v of VALUES) {
      const cur = (await t.http().get(`/api/permits/${permit.id}`).set(as('permit_clerk'))).body;
      const top = p.split('.')[0];
      await check(`PATCH permit ${p}=${JSON.stringify(v)}`, t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send(setPath({ version: cur.version, [top]: (pbody as any)[top] }, p, v)));
    }
    for (const q of ['page', 'pageSize', 'search', 'stage', 'sort', 'jurisdiction', 'assignee', 'status', 'moveId', 'role'])
      for (const v of ['%00', '1e20', '-1', 'x', '', '%E0%A4%A', 'a&' + q + '=b'])
        for (const path of ['/api/moves', '/api/permits', '/api/users', '/api/vendors', '/api/payments', '/api/mail/outbox'])
          await check(`GET ${path}?${q}=${v}`, t.http().get(`${path}?${q}=${v}`).set(as('admin')));
    for (const path of ['/api/moves/%00', '/api/rulebook/jurisdictions/%00/versions', '/api/fleet/tractors/%00', '/api/escort-responses/%00', '/api/moves/%E0%A4%A'])
      await check(`GET ${path}`, t.http().get(path).set(as('admin')));
    console.log(bad.length ? bad.join('\n') : 'NO 5xx');
  }, 600000);
});
