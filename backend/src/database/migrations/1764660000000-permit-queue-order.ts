import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The permit desk's default order (open permits first, by file-by date, then departure) read from one index:
 * the move's departure and the file-by date are kept on the permit row by triggers, so the queue no longer sorts
 * every permit joined with its move.
 */
export class PermitQueueOrder1764660000000 implements MigrationInterface {
  name = 'PermitQueueOrder1764660000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE permits ADD COLUMN departure date, ADD COLUMN file_by date`);
    await q.query(`UPDATE permits p SET departure = m.requested_departure, file_by = m.requested_departure - p.lead_time_days FROM moves m WHERE m.id = p.move_id`);
    await q.query(`ALTER TABLE permits ADD COLUMN urgency_group smallint GENERATED ALWAYS AS (CASE WHEN status IN ('issued','void') THEN 1 ELSE 0 END) STORED`);
    await q.query(`
      CREATE FUNCTION permits_set_dates() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        SELECT m.requested_departure INTO NEW.departure FROM moves m WHERE m.id = NEW.move_id;
        NEW.file_by := NEW.departure - NEW.lead_time_days;
        RETURN NEW;
      END $$`);
    await q.query(`CREATE TRIGGER permits_dates BEFORE INSERT OR UPDATE OF move_id, lead_time_days ON permits FOR EACH ROW EXECUTE FUNCTION permits_set_dates()`);
    await q.query(`
      CREATE FUNCTION moves_departure_to_permits() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        UPDATE permits SET departure = NEW.requested_departure, file_by = NEW.requested_departure - lead_time_days WHERE move_id = NEW.id;
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE TRIGGER moves_departure AFTER UPDATE OF requested_departure ON moves FOR EACH ROW
        WHEN (OLD.requested_departure IS DISTINCT FROM NEW.requested_departure) EXECUTE FUNCTION moves_departure_to_permits()`);
    await q.query(`CREATE INDEX permits_queue_urgency ON permits (urgency_group, file_by, departure, id) WHERE status <> 'void'`);
    await q.query(`CREATE INDEX permits_queue_departure ON permits (departure, jurisdiction, id) WHERE status <> 'void'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX permits_queue_departure`);
    await q.query(`DROP INDEX permits_queue_urgency`);
    await q.query(`DROP TRIGGER moves_departure ON moves`);
    await q.query(`DROP FUNCTION moves_departure_to_permits()`);
    await q.query(`DROP TRIGGER permits_dates ON permits`);
    await q.query(`DROP FUNCTION permits_set_dates()`);
    await q.query(`ALTER TABLE permits DROP COLUMN urgency_group, DROP COLUMN file_by, DROP COLUMN departure`);
  }
}
