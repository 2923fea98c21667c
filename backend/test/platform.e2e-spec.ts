import { Client } from 'pg';
import { runMigrations } from '../src/database/migrate';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('platform', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('reports health with the database up', async () => {
    const res = await t.http().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up' });
  });

  it('answers an unknown API route with a JSON 404', async () => {
    const res = await t.http().get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ statusCode: 404, error: 'not_found', message: 'No such route' });
  });

  it('sends security headers', async () => {
    const res = await t.http().get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
  });

  it('runs every migration on an empty database, and reverts them all', async () => {
    const base = process.env.DATABASE_URL!;
    const name = `amberline_test_mig_${process.pid}`;
    const admin = new Client({ connectionString: base });
    await admin.connect();
    await admin.query(`DROP DATABASE IF EXISTS ${name}`);
    await admin.query(`CREATE DATABASE ${name}`);
    const url = base.replace(/\/[^/]+$/, `/${name}`);
    try {
      const applied = await runMigrations(url);
      expect(applied.length).toBeGreaterThan(0);
      expect(await runMigrations(url)).toEqual([]); // idempotent
      const c = new Client({ connectionString: url });
      await c.connect();
      const tables = (await c.query(`SELECT tablename FROM pg_tables WHERE schemaname = 'public'`)).rows.map((r) => r.tablename);
      expect(tables).toEqual(expect.arrayContaining(['users', 'login_failures', 'migrations']));
      await c.end();
      const { DataSource } = await import('typeorm');
      const { typeormOptions } = await import('../src/database/typeorm-options');
      const ds = new DataSource(typeormOptions(url));
      await ds.initialize();
      for (let i = 0; i < applied.length; i++) await ds.undoLastMigration({ transaction: 'all' });
      const left = await ds.query(`SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'migrations'`);
      expect(left).toEqual([]);
      await ds.destroy();
    } finally {
      await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await admin.end();
    }
  });
});
