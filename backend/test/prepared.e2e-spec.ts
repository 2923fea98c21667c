import { seedTractor, seedTrailer, seedUser } from '@amberline/seed';
import { entityColumns, entityFromRow, preparedQuery } from '../src/database/prepared';
import { Move } from '../src/moves/entities/move.entity';
import { MovesService } from '../src/moves/moves.service';
import { texasMove } from './fixtures/moves';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('prepared statements for hot reads', () => {
  let t: TestApp;
  const table = `prepared_probe_${process.pid}_${Date.now()}`;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.ds.query(`DROP TABLE IF EXISTS ${table}`);
    await t.close();
  });

  it('returns the same rows as a plain query, on the pool and inside a transaction', async () => {
    const sql = `SELECT id, email FROM users WHERE role = $1 ORDER BY email LIMIT 5`;
    const plain = await t.ds.query(sql, ['admin']);
    expect(await preparedQuery(t.ds, sql, ['admin'])).toEqual(plain);
    expect(await preparedQuery(t.ds, sql, ['admin'])).toEqual(plain); // second run: the statement is already prepared
    const inTx = await t.ds.transaction((m) => preparedQuery(m, sql, ['admin']));
    expect(inTx).toEqual(plain);
  });

  it('rebuilds an entity as TypeORM does: numeric through its transformer, a date column as YYYY-MM-DD, jsonb parsed', async () => {
    const admin = await seedUser(t.ds, { role: 'dispatcher' });
    const tractorId = (await seedTractor(t.ds)).id;
    const trailerId = (await seedTrailer(t.ds)).id;
    const dto = await t.app.get(MovesService).create(texasMove(tractorId, trailerId), { id: admin.id, role: 'dispatcher', email: admin.email, name: admin.name }, new Date());
    const meta = t.ds.getMetadata(Move);
    const [row] = await preparedQuery<Record<string, unknown>>(t.ds, `SELECT ${entityColumns(meta, 'm', 'm.')} FROM moves m WHERE m.id = $1`, [dto.id]);
    const fromRow = entityFromRow<Move>(meta, row, 'm.')!;
    const fromOrm = await t.ds.getRepository(Move).findOneByOrFail({ id: dto.id });
    expect(fromRow).toBeInstanceOf(Move);
    expect(fromRow.sliderSettingFt).toBe(39);
    expect(fromRow.requestedDeparture).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect({ ...fromRow }).toEqual({ ...fromOrm });
    expect(entityFromRow(meta, { 'm.id': null }, 'm.')).toBeNull();
  });

  it('falls back to an unprepared run when a table changed under a prepared statement (a migration while running)', async () => {
    await t.ds.query(`CREATE TABLE ${table} (id int PRIMARY KEY, label text)`);
    await t.ds.query(`INSERT INTO ${table} VALUES (1, 'one')`);
    const sql = `SELECT * FROM ${table} ORDER BY id`;
    // prepare it on every pooled connection a query may land on
    await Promise.all(Array.from({ length: 25 }, () => preparedQuery(t.ds, sql)));
    await t.ds.query(`ALTER TABLE ${table} ADD COLUMN extra int DEFAULT 7`);
    const rows = await Promise.all(Array.from({ length: 25 }, () => preparedQuery(t.ds, sql)));
    for (const r of rows) expect(r).toEqual([{ id: 1, label: 'one', extra: 7 }]);
  });
});
