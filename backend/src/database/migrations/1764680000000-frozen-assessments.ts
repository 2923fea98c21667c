import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A move past `requested` keeps the rule versions its assessment used (re-assessing with current rules is an
 * explicit, audited step), and the moment of its last stage change (reopening a delivered move is allowed for a
 * few days after delivery), and the daily distance of its day plan. Departure checks keep a scale weight the driver recorded and a dispatcher's override.
 */
export class FrozenAssessments1764680000000 implements MigrationInterface {
  name = 'FrozenAssessments1764680000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE moves ADD COLUMN rule_versions jsonb NULL, ADD COLUMN stage_changed_at timestamptz NULL, ADD COLUMN daily_miles int NULL`);
    // moves already past requested keep the versions they run on now
    await q.query(`
      UPDATE moves m SET rule_versions = (
        SELECT jsonb_object_agg(j.code, j.current_version) FROM jurisdictions j WHERE j.code = ANY(m.jurisdictions)
      ) WHERE m.stage <> 'requested'`);
    await q.query(`UPDATE moves SET stage_changed_at = updated_at WHERE stage <> 'requested'`);
    // a gauge estimate far off the plan is answered by a scale weight or a dispatcher's override with a reason
    await q.query(`ALTER TABLE departure_checks ADD COLUMN scale_weights jsonb NOT NULL DEFAULT '[]'::jsonb, ADD COLUMN override jsonb NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE departure_checks DROP COLUMN scale_weights, DROP COLUMN override`);
    await q.query(`ALTER TABLE moves DROP COLUMN rule_versions, DROP COLUMN stage_changed_at, DROP COLUMN daily_miles`);
  }
}
