import type { Role } from '@amberline/common';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('/api/users', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  beforeAll(async () => {
    t = await createTestApp();
    for (const [role, u] of Object.entries(await t.signedInAll())) tokens[role as Role] = u.token;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });

  describe('role matrix', () => {
    it.each([
      ['admin', 200, 201, 200],
      ['dispatcher', 403, 403, 403],
      ['permit_clerk', 403, 403, 403],
      ['driver', 403, 403, 403],
    ] as [Role, number, number, number][])('%s: list %i, create %i, update %i', async (role, list, create, update) => {
      const target = await t.signedIn({ role: 'driver' });
      expect((await t.http().get('/api/users').set(as(role))).status).toBe(list);
      const email = `matrix.${role}.${Date.now()}@test.amberline.example`;
      expect((await t.http().post('/api/users').set(as(role)).send({ email, name: 'M', role: 'driver', password: 'long-enough-pass' })).status).toBe(create);
      expect((await t.http().patch(`/api/users/${target.id}`).set(as(role)).send({ role: 'dispatcher' })).status).toBe(update);
    });

    it('refuses callers without a token', async () => {
      expect((await t.http().get('/api/users')).status).toBe(401);
      expect((await t.http().post('/api/users').send({})).status).toBe(401);
    });
  });

  it('creates a user who can then sign in, and lists with paging, role filter and search', async () => {
    const email = `new.clerk.${Date.now()}@test.amberline.example`;
    const created = await t.http().post('/api/users').set(as('admin')).send({ email, name: 'Juniper Quell', role: 'permit_clerk', password: 'long-enough-pass' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ email, name: 'Juniper Quell', role: 'permit_clerk', active: true });
    expect(created.body).not.toHaveProperty('passwordHash');
    const login = await t.http().post('/api/auth/login').set('x-forwarded-for', '10.99.0.1').send({ email, password: 'long-enough-pass' });
    expect(login.status).toBe(200);
    const list = await t.http().get('/api/users').query({ role: 'permit_clerk', search: 'Juniper', pageSize: 5 }).set(as('admin'));
    expect(list.status).toBe(200);
    expect(list.body.items.map((u: { email: string }) => u.email)).toContain(email);
    expect(list.body.pageSize).toBe(5);
    expect(list.body.items.every((u: { role: string }) => u.role === 'permit_clerk')).toBe(true);
  });

  it('changes a role and rejects a duplicate e-mail with 409', async () => {
    const u = await t.signedIn({ role: 'driver' });
    const res = await t.http().patch(`/api/users/${u.id}`).set(as('admin')).send({ role: 'dispatcher' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('dispatcher');
    const dup = await t.http().post('/api/users').set(as('admin')).send({ email: u.email.toUpperCase(), name: 'Dup', role: 'driver', password: 'long-enough-pass' });
    expect(dup.status).toBe(409);
    expect(dup.body.details).toEqual([{ field: 'email', reason: 'already taken' }]);
  });

  it('keeps an admin from deactivating themselves', async () => {
    const admin = await t.signedIn({ role: 'admin' });
    const res = await t.http().patch(`/api/users/${admin.id}`).set({ authorization: `Bearer ${admin.token}` }).send({ active: false });
    expect(res.status).toBe(409);
  });

  describe('bad input gets a 400 naming the field', () => {
    it.each([
      ['missing e-mail', { name: 'A', role: 'driver', password: 'long-enough-pass' }, 'email'],
      ['not an e-mail', { email: 'nope', name: 'A', role: 'driver', password: 'long-enough-pass' }, 'email'],
      ['unknown role', { email: 'a@b.example', name: 'A', role: 'pilot', password: 'long-enough-pass' }, 'role'],
      ['short password', { email: 'a@b.example', name: 'A', role: 'driver', password: 'short' }, 'password'],
      ['over-long name', { email: 'a@b.example', name: 'x'.repeat(121), role: 'driver', password: 'long-enough-pass' }, 'name'],
      ['wrong type', { email: 'a@b.example', name: 42, role: 'driver', password: 'long-enough-pass' }, 'name'],
      ['unknown field', { email: 'a@b.example', name: 'A', role: 'driver', password: 'long-enough-pass', isRoot: true }, 'isRoot'],
    ])('%s', async (_label, body, field) => {
      const res = await t.http().post('/api/users').set(as('admin')).send(body);
      expect(res.status).toBe(400);
      expect(res.body.error).toBe('validation_failed');
      expect(res.body.details.map((d: { field: string }) => d.field)).toContain(field);
      expect(res.body.message).toContain(field);
    });

    it('malformed JSON', async () => {
      const res = await t.http().post('/api/users').set(as('admin')).set('content-type', 'application/json').send('{"email": ');
      expect(res.status).toBe(400);
      expect(res.body.message).toMatch(/malformed JSON/);
      expect(JSON.stringify(res.body)).not.toMatch(/at .*\.js/);
    });

    it('a user id that is not a UUID', async () => {
      const res = await t.http().patch('/api/users/123').set(as('admin')).send({ role: 'driver' });
      expect(res.status).toBe(400);
    });

    it('a page size over the limit', async () => {
      const res = await t.http().get('/api/users').query({ pageSize: 1000 }).set(as('admin'));
      expect(res.status).toBe(400);
      expect(res.body.details[0].field).toBe('pageSize');
    });
  });
});
