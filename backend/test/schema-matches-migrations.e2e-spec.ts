import { DataSource } from 'typeorm';
import { fileByDate } from '@amberline/common';
import { createTestApp, type TestApp } from './utils/create-test-app';

/** The tables of the permits, rulebook, fleet, vendors and users modules. */
const TABLES = ['permits', 'permit_documents', 'permit_payments', 'permit_versions', 'jurisdictions', 'rule_versions', 'tractors', 'trailers', 'vendors', 'users'];
const onTable = (q: string) => TABLES.find((t) => q.includes(`"${t}"`));

/**
 * The entities say what the migrations built: on the migrated test database, what TypeORM would generate from the
 * entities (the check `migration:generate` makes on a clean schema) adds, drops or retypes no column.
 */
describe('entities and migrations', () => {
  let t: TestApp;
  let ds: DataSource;
  beforeAll(async () => {
    t = await createTestApp();
    ds = t.app.get(DataSource);
  });
  afterAll(() => t.close());

  it('a migration generated from the entities proposes no column change on these modules’ tables', async () => {
    const sql = await ds.driver.createSchemaBuilder().log();
    const columnChanges = sql.upQueries
      .map((q) => q.query)
      .filter((q) => onTable(q) && /ADD COLUMN|DROP COLUMN|ALTER COLUMN "[^"]+" TYPE|CREATE TABLE|DROP TABLE/.test(q));
    expect(columnChanges).toEqual([]);
  });

  it('the permit carries the columns the queue migration added (departure, file_by, urgency_group)', () => {
    const cols = ds.getMetadata('permits').columns.map((c) => c.databaseName);
    expect(cols).toEqual(expect.arrayContaining(['departure', 'file_by', 'urgency_group']));
  });

  it("the stored file-by date (the trigger's arithmetic) agrees with fileByDate", async () => {
    const cases: [string, number][] = [['2026-12-10', 2], ['2026-12-10', 0], ['2026-03-02', 3], ['2028-03-01', 1], ['2027-01-02', 5]];
    for (const [departure, lead] of cases) {
      const [{ d }] = await ds.query(`SELECT to_char($1::date - $2::int, 'YYYY-MM-DD') AS d`, [departure, lead]);
      expect(d).toBe(fileByDate(departure, lead));
    }
    // and every stored row, as the trigger wrote it
    const rows: { departure: string; lead: number; file_by: string }[] = await ds.query(
      `SELECT to_char(departure, 'YYYY-MM-DD') AS departure, lead_time_days AS lead, to_char(file_by, 'YYYY-MM-DD') AS file_by FROM permits WHERE departure IS NOT NULL LIMIT 500`,
    );
    for (const r of rows) expect(r.file_by).toBe(fileByDate(r.departure, r.lead));
  });
});
