import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * TypeORM reads the expression of a generated column from its own `typeorm_metadata` table (PostgreSQL reformats
 * the expression it keeps). The permit queue's `urgency_group` is recorded there, so a migration generated from the
 * entities compares it with the entity's expression instead of proposing to rebuild the column.
 */
export class GeneratedColumnMetadata1764690000000 implements MigrationInterface {
  name = 'GeneratedColumnMetadata1764690000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE IF NOT EXISTS typeorm_metadata (
        "type" varchar NOT NULL, "database" varchar NULL, "schema" varchar NULL, "table" varchar NULL, "name" varchar NULL, "value" text NULL
      )`);
    await q.query(
      `INSERT INTO typeorm_metadata ("type", "database", "schema", "table", "name", "value")
       VALUES ('GENERATED_COLUMN', current_database(), current_schema(), 'permits', 'urgency_group', $1)`,
      [`CASE WHEN status IN ('issued','void') THEN 1 ELSE 0 END`],
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DELETE FROM typeorm_metadata WHERE "type" = 'GENERATED_COLUMN' AND "table" = 'permits' AND "name" = 'urgency_group'`);
    // the table came with this migration: it goes with it unless something else was recorded there since
    const [{ n }] = await q.query(`SELECT count(*)::int AS n FROM typeorm_metadata`);
    if (n === 0) await q.query(`DROP TABLE typeorm_metadata`);
  }
}
