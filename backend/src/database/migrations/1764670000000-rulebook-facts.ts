import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Rulebook records become facts with their own status and source (schema 2). A permit keeps whether its lead time
 * came from the rulebook or was not on file (then the file-by date is the departure itself and the desk says so).
 */
export class RulebookFacts1764670000000 implements MigrationInterface {
  name = 'RulebookFacts1764670000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE permits ADD COLUMN lead_time_known boolean NOT NULL DEFAULT true`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE permits DROP COLUMN lead_time_known`);
  }
}
