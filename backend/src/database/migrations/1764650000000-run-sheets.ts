import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RunSheets1764650000000 implements MigrationInterface {
  name = 'RunSheets1764650000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE departure_checks (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        move_id uuid NOT NULL REFERENCES moves(id) ON DELETE CASCADE,
        driver_id uuid NOT NULL REFERENCES users(id),
        fingerprint varchar(64) NOT NULL,
        measured_height_in numeric(7,2) NOT NULL,
        measured_width_in numeric(7,2) NOT NULL,
        measured_length_in numeric(8,2) NOT NULL,
        slider_pins_locked boolean NOT NULL,
        tires_inflated boolean NOT NULL,
        markings_in_place boolean NOT NULL,
        permits_on_board boolean NOT NULL,
        gauge_readings jsonb NOT NULL,
        gauge_estimates jsonb NOT NULL,
        findings jsonb NOT NULL,
        outcome varchar(10) NOT NULL CHECK (outcome IN ('passed', 'blocked')),
        submitted_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX departure_checks_move_idx ON departure_checks (move_id, submitted_at DESC)`);
    await q.query(`
      CREATE TABLE run_sheet_acknowledgements (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        move_id uuid NOT NULL REFERENCES moves(id) ON DELETE CASCADE,
        driver_id uuid NOT NULL REFERENCES users(id),
        checks_id uuid NOT NULL REFERENCES departure_checks(id),
        fingerprint varchar(64) NOT NULL,
        acknowledged_at timestamptz NOT NULL DEFAULT now(),
        voided_at timestamptz,
        void_reason text
      )`);
    await q.query(`CREATE INDEX run_sheet_ack_move_idx ON run_sheet_acknowledgements (move_id, acknowledged_at DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE run_sheet_acknowledgements`);
    await q.query(`DROP TABLE departure_checks`);
  }
}
