import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import type { MoveDto, PermitDto, Role } from '@amberline/common';
import { seedTractor, seedTrailer, vendorDefaults } from '@amberline/seed';
import type { Response } from 'supertest';
import { texasMove } from './fixtures/moves';
import { createServedTestApp, nextIp, type TestApp } from './utils/create-test-app';

/**
 * No input answers 5xx: each kind of bad input is refused with a 4xx that names the field and the reason, in the
 * configuration `npm start` runs (the built front end served next to the API).
 */
describe('bad input is refused with a 4xx naming the field', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  let tractorId: string;
  let trailerId: string;
  let driverId: string;
  beforeAll(async () => {
    if (!existsSync(join(__dirname, '..', '..', 'frontend', 'dist', 'index.html'))) throw new Error('the front end is not built (npm test builds it)');
    t = await createServedTestApp();
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) tokens[role] = users[role].token;
    driverId = users.driver.id;
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });
  const newMove = async (over = {}): Promise<MoveDto> => {
    const res = await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, over));
    expect(res.status).toBe(201);
    return res.body;
  };
  const newPermit = async (): Promise<PermitDto> => {
    const move = await newMove();
    expect((await t.http().post(`/api/moves/${move.id}/permits/sync`).set(as('permit_clerk'))).status).toBe(200);
    const [permit] = (await t.http().get(`/api/moves/${move.id}/permits`).set(as('permit_clerk'))).body;
    return permit;
  };
  /** JSON as written, for bodies JSON.stringify would not produce (exponent notation, deep nesting, no object). */
  const raw = (req: ReturnType<ReturnType<TestApp['http']>['post']>, text: string) => req.set('content-type', 'application/json').send(text);

  /** The status, the error code, and `field` among the details with a reason (matching `reason` when given). */
  const expectRefused = (res: Response, status: number, field: string, reason?: RegExp) => {
    expect({ status: res.status, field }).toEqual({ status, field });
    expect(res.body.statusCode).toBe(status);
    if (status === 400) expect(res.body.error).toBe('validation_failed');
    expect(res.body.details).toEqual(expect.arrayContaining([{ field, reason: reason ? expect.stringMatching(reason) : expect.any(String) }]));
    expect(res.body.message).toContain(field);
  };

  it('1. JSON nested 5,000 levels deep is refused before validation, on sign-in, the vendor answer route and the desk', async () => {
    const deepObject = '{"a":'.repeat(5000) + '1' + '}'.repeat(5000); // 30 kB
    const deepArray = '['.repeat(5000) + ']'.repeat(5000);
    const depth = /more than 32 levels deep/;
    const login = await raw(t.http().post('/api/auth/login').set('x-forwarded-for', nextIp()), `{"email":${deepObject},"password":"long-enough-pass"}`);
    expectRefused(login, 400, 'email', depth);
    expectRefused(await raw(t.http().post('/api/auth/login').set('x-forwarded-for', nextIp()), deepArray), 400, 'body', depth);
    expectRefused(await raw(t.http().post(`/api/escort-responses/${'A'.repeat(43)}`), `{"decision":${deepArray}}`), 400, 'decision', depth);
    expectRefused(await raw(t.http().post('/api/moves').set(as('dispatcher')), `{"articles":[${deepObject}]}`), 400, 'articles', depth);
    // nesting the API takes is untouched
    expect((await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId))).status).toBe(201);
  });

  it('2. a NUL character in any string of a body (or in a property name) is refused, naming the field', async () => {
    const nul = /NUL character/;
    expectRefused(await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, { customer: 'Ironleaf\u0000' })), 400, 'customer', nul);
    const article = texasMove(tractorId, trailerId).articles[0];
    const nested = await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, { articles: [{ ...article, description: 'Excavator\u0000' }] }));
    expectRefused(nested, 400, 'articles[0].description', nul);
    const user = await t.signedIn({ role: 'driver' });
    expectRefused(await t.http().patch(`/api/users/${user.id}`).set(as('admin')).send({ name: 'Juniper\u0000Quell' }), 400, 'name', nul);
    expectRefused(await t.http().post('/api/auth/login').set('x-forwarded-for', nextIp()).send({ email: 'a\u0000@b.example', password: 'long-enough-pass' }), 400, 'email', nul);
    // a rule record is free-form JSON stored as jsonb: names and values are checked as deep as they go
    const { record } = (await t.http().get('/api/rulebook/jurisdictions/KS').set(as('admin'))).body;
    const res = await t.http().put('/api/rulebook/jurisdictions/KS').set(as('admin')).send({ record: { ...record, legal: { ...record.legal, 'width\u0000In': 1 } }, note: 'a NUL in a name' });
    expectRefused(res, 400, 'record.legal.width\u0000In', /its name must not contain the NUL character/);
  });

  it('3. a NUL character in a query string or a path is refused, naming the parameter', async () => {
    expectRefused(await t.http().get('/api/moves?search=%00').set(as('dispatcher')), 400, 'search', /NUL character/);
    expectRefused(await t.http().get('/api/users?search=a%00b').set(as('admin')), 400, 'search', /NUL character/);
    expectRefused(await t.http().get('/api/rulebook/jurisdictions/%00').set(as('dispatcher')), 400, 'code', /NUL character/);
    expectRefused(await t.http().get(`/api/escort-responses/${'A'.repeat(42)}%00`), 400, 'token', /NUL character/);
    expect((await t.http().get('/api/moves?search=Ironleaf').set(as('dispatcher'))).status).toBe(200);
  });

  it('4. page numbers are bounded whole numbers: page=1e20 on the moves list and the permit queue is a 400 naming page', async () => {
    for (const [path, role] of [['/api/moves', 'dispatcher'], ['/api/permits', 'permit_clerk'], ['/api/users', 'admin']] as [string, Role][]) {
      expectRefused(await t.http().get(`${path}?page=1e20`).set(as(role)), 400, 'page', /must not be greater than 100000/);
      expectRefused(await t.http().get(`${path}?page=1.5`).set(as(role)), 400, 'page');
      const last = await t.http().get(`${path}?page=100000&pageSize=100`).set(as(role));
      expect(last.status).toBe(200);
      expect(last.body).toMatchObject({ items: [], page: 100000, pageSize: 100 });
    }
  });

  it('5. the permit queue takes assignee as me, none or a real user id only (36 dashes are not an id)', async () => {
    expectRefused(await t.http().get(`/api/permits?assignee=${'-'.repeat(36)}`).set(as('permit_clerk')), 400, 'assignee', /user id, me or none/);
    expectRefused(await t.http().get(`/api/permits?assignee=${'f'.repeat(36)}`).set(as('permit_clerk')), 400, 'assignee');
    expectRefused(await t.http().get('/api/permits?assignee=ME').set(as('permit_clerk')), 400, 'assignee');
    for (const assignee of ['me', 'none', driverId]) expect((await t.http().get(`/api/permits?assignee=${assignee}`).set(as('permit_clerk'))).status).toBe(200);
  });

  it('6. a PATCH may leave a required field out but not send it as null: users, moves and permits', async () => {
    const notNull = /must not be null/;
    const user = await t.signedIn({ role: 'driver' });
    const u = await t.http().patch(`/api/users/${user.id}`).set(as('admin')).send({ name: null });
    expectRefused(u, 400, 'name', notNull);
    expect(u.body.details).toHaveLength(1); // the one reason, not one per check of the missing value
    expectRefused(await t.http().patch(`/api/users/${user.id}`).set(as('admin')).send({ active: null }), 400, 'active', notNull);

    const move = await newMove();
    for (const field of ['customer', 'articles', 'route', 'tractorId', 'requestedDeparture', 'travelDays']) {
      expectRefused(await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, [field]: null }), 400, field, notNull);
    }
    // null still clears what may be empty
    const cleared = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, driverId: null, notes: null });
    expect(cleared.status).toBe(200);

    const permit = await newPermit();
    for (const field of ['permitType', 'status', 'conditions']) {
      expectRefused(await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: permit.version, [field]: null }), 400, field, notNull);
    }
    expect((await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: permit.version, notes: null })).status).toBe(200);
  });

  it('7. an array (or anything but an object) where an object belongs is refused: articles, operators, insurance', async () => {
    const objects = /must be an object/;
    expectRefused(await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, { articles: [[]] as never })), 400, 'articles', objects);
    expectRefused(await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, { route: ['TX'] as never })), 400, 'route', objects);
    expectRefused(await t.http().post('/api/vendors').set(as('dispatcher')).send({ ...vendorDefaults(), operators: [[]] }), 400, 'operators', objects);
    expectRefused(await t.http().post('/api/vendors').set(as('dispatcher')).send({ ...vendorDefaults(), insurance: [] }), 400, 'insurance', objects);
    const permit = await newPermit();
    expectRefused(await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: permit.version, conditions: [] }), 400, 'conditions', objects);
  });

  it('8. a fee is read by its value whatever the notation: 1e-7 is refused as too many decimals, 2.5e2 is $250', async () => {
    const permit = await newPermit();
    const tiny = await raw(t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')), `{"version":${permit.version},"actualFeeUsd":1e-7}`);
    expectRefused(tiny, 400, 'actualFeeUsd', /at most 2 decimals/);
    expectRefused(await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: permit.version, actualFeeUsd: 12.345 }), 400, 'actualFeeUsd', /at most 2 decimals/);
    const fine = await raw(t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')), `{"version":${permit.version},"actualFeeUsd":2.5e2}`);
    expect(fine.status).toBe(200);
    expect(fine.body.actualFeeUsd).toBe(250);
    const cents = await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: fine.body.version, actualFeeUsd: 210.15 });
    expect(cents.status).toBe(200);
    expect(cents.body.actualFeeUsd).toBe(210.15);
  });

  it('9. dates are YYYY-MM-DD or full ISO date-times: week (2026-W49-3) and ordinal (2026-336) dates are refused', async () => {
    const permit = await newPermit();
    for (const issuedAt of ['2026-W49-3', '2026-336', '2026-12-01T14:30', '2026-12-01T24:00:00Z']) {
      expectRefused(await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: permit.version, issuedAt }), 400, 'issuedAt', /ISO date and time/);
    }
    for (const requestedDeparture of ['2026-W49-3', '2026-336']) {
      expectRefused(await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, { requestedDeparture })), 400, 'requestedDeparture', /YYYY-MM-DD/);
    }
    const vendor = vendorDefaults();
    vendor.operators[0].certifications[0].expires = '2099-W01-1';
    expectRefused(await t.http().post('/api/vendors').set(as('dispatcher')).send(vendor), 400, 'operators[0].certifications[0].expires', /YYYY-MM-DD/);
    const ok = await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: permit.version, issuedAt: '2026-12-01T14:30:00-06:00' });
    expect(ok.status).toBe(200);
    expect(ok.body.issuedAt).toBe('2026-12-01T20:30:00.000Z');
  });

  it('10. impossible calendar dates are refused: in a rule record, a move, a permit validity and a vendor', async () => {
    const { record } = (await t.http().get('/api/rulebook/jurisdictions/NE').set(as('admin'))).body;
    const put = (r: unknown) => t.http().put('/api/rulebook/jurisdictions/NE').set(as('admin')).send({ record: r, note: 'an impossible date' });
    expectRefused(await put({ ...record, asOf: '2026-02-30' }), 400, 'record.asOf', /not a real calendar date/);
    const fact = Object.keys(record.legal).find((k) => record.legal[k].status !== 'unknown');
    if (fact) expectRefused(await put({ ...record, legal: { ...record.legal, [fact]: { ...record.legal[fact], asOf: '2027-02-29' } } }), 400, `record.legal.${fact}.asOf`, /not a real calendar date/);
    const move = await newMove();
    expectRefused(await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, requestedDeparture: '2099-02-30' }), 400, 'requestedDeparture', /YYYY-MM-DD/);
    const permit = await newPermit();
    expectRefused(await t.http().patch(`/api/permits/${permit.id}`).set(as('permit_clerk')).send({ version: permit.version, validFrom: '2099-04-31T08:00' }), 400, 'validFrom', /local date and time/);
    const vendor = vendorDefaults();
    vendor.insurance.expires = '2099-13-01';
    expectRefused(await t.http().post('/api/vendors').set(as('dispatcher')).send(vendor), 400, 'insurance.expires', /YYYY-MM-DD/);
  });

  it('11. every body the parser refuses answers 400, 413 or 415 naming the part, with the front end served', async () => {
    // the served configuration: the front end's pages answer next to the API
    const page = await t.http().get('/moves');
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
    // one pair of parsers (configureApp's), so the refusal below is theirs
    const layers: { name: string }[] = t.app.getHttpAdapter().getInstance().router.stack;
    expect(layers.filter((l) => l.name === 'jsonParser')).toHaveLength(1);

    const login = () => t.http().post('/api/auth/login').set('x-forwarded-for', nextIp());
    expectRefused(await raw(login(), '{"email": '), 400, 'body', /malformed JSON/);
    expectRefused(await raw(login(), '"alice@example.com"'), 400, 'body', /must be a JSON object or array/);
    expectRefused(await raw(t.http().post('/api/moves').set(as('dispatcher')), 'null'), 400, 'body', /must be a JSON object or array/);
    expectRefused(await login().send({ email: 'x'.repeat(200_000), password: 'long-enough-pass' }), 413, 'body', /at most 100 kB/);
    expectRefused(await login().set('content-type', 'application/json; charset=klingon').send('{}'), 415, 'content-type', /charset klingon is not supported/);
    expectRefused(await login().set('content-type', 'application/json').set('content-encoding', 'zstd-x').send('{}'), 415, 'content-encoding', /not supported/);
    expectRefused(await login().set('content-type', 'application/json').set('content-encoding', 'gzip').send('{"email":"a@b.example"}'), 400, 'body', /cannot be decompressed/);
    // a well-formed compressed body is read as before
    const gzipped = gzipSync(JSON.stringify({ email: 'nobody@test.amberline.example', password: 'long-enough-pass' }));
    const gz = await login().set('content-type', 'application/json').set('content-encoding', 'gzip').serialize(((b: Buffer) => b) as unknown as (obj: unknown) => string).send(gzipped);
    expect(gz.status).toBe(401);
    // an unknown route under /api is still a 404
    expect((await t.http().get('/api/no-such-route').set(as('dispatcher'))).body.message).toBe('No such route');
  });
});
