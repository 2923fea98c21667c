import type { MigrationInterface, QueryRunner } from 'typeorm';

export class FleetRulebookMoves1764620000000 implements MigrationInterface {
  name = 'FleetRulebookMoves1764620000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE tractors (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        unit_number varchar(40) NOT NULL UNIQUE,
        plate varchar(20) NOT NULL,
        spec jsonb NOT NULL,
        active boolean NOT NULL DEFAULT true,
        version int NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE trailers (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        unit_number varchar(40) NOT NULL UNIQUE,
        type varchar(30) NOT NULL,
        spec jsonb NOT NULL,
        active boolean NOT NULL DEFAULT true,
        version int NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE jurisdictions (
        code varchar(2) PRIMARY KEY,
        name varchar(60) NOT NULL,
        current_version int NOT NULL DEFAULT 0
      )`);
    await q.query(`
      CREATE TABLE rule_versions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        code varchar(2) NOT NULL REFERENCES jurisdictions(code),
        version int NOT NULL,
        record jsonb NOT NULL,
        sample boolean NOT NULL,
        as_of date NOT NULL,
        note text,
        created_by uuid REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (code, version)
      )`);
    await q.query(`CREATE SEQUENCE move_reference_seq START 1001`);
    await q.query(`
      CREATE TABLE moves (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        reference varchar(20) NOT NULL UNIQUE,
        customer varchar(120) NOT NULL,
        customer_ref varchar(60),
        commodity varchar(200) NOT NULL,
        stage varchar(20) NOT NULL DEFAULT 'requested'
          CHECK (stage IN ('requested','permits_received','escorts_booked','running','delivered','cancelled')),
        tractor_id uuid NOT NULL REFERENCES tractors(id),
        trailer_id uuid NOT NULL REFERENCES trailers(id),
        driver_id uuid REFERENCES users(id),
        slider_setting_ft numeric(6,2),
        articles jsonb NOT NULL,
        route jsonb NOT NULL,
        jurisdictions varchar(2)[] NOT NULL,
        origin varchar(200) NOT NULL,
        destination varchar(200) NOT NULL,
        requested_departure date NOT NULL,
        travel_days int NOT NULL DEFAULT 1,
        notes text,
        summary jsonb NOT NULL DEFAULT '{}'::jsonb,
        plan_revision int NOT NULL DEFAULT 1,
        version int NOT NULL DEFAULT 1,
        created_by uuid REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX moves_stage_departure_idx ON moves (stage, requested_departure, id)`);
    await q.query(`CREATE INDEX moves_departure_idx ON moves (requested_departure, id)`);
    await q.query(`CREATE INDEX moves_updated_idx ON moves (updated_at DESC, id)`);
    await q.query(`CREATE INDEX moves_driver_idx ON moves (driver_id) WHERE driver_id IS NOT NULL`);
    await q.query(`CREATE INDEX moves_jurisdictions_idx ON moves USING gin (jurisdictions)`);
    await q.query(`CREATE EXTENSION IF NOT EXISTS pg_trgm`);
    await q.query(`CREATE INDEX moves_search_idx ON moves USING gin ((reference || ' ' || customer || ' ' || commodity || ' ' || origin || ' ' || destination) gin_trgm_ops)`);
    await q.query(`
      CREATE TABLE audit_entries (
        id bigserial PRIMARY KEY,
        move_id uuid REFERENCES moves(id) ON DELETE CASCADE,
        entity varchar(30) NOT NULL,
        entity_id varchar(60) NOT NULL,
        action varchar(40) NOT NULL,
        actor_id uuid REFERENCES users(id),
        at timestamptz NOT NULL DEFAULT now(),
        before jsonb,
        after jsonb,
        reason text
      )`);
    await q.query(`CREATE INDEX audit_entries_move_idx ON audit_entries (move_id, at, id)`);
    await q.query(`CREATE INDEX audit_entries_entity_idx ON audit_entries (entity, entity_id, at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE audit_entries`);
    await q.query(`DROP TABLE moves`);
    await q.query(`DROP SEQUENCE move_reference_seq`);
    await q.query(`DROP TABLE rule_versions`);
    await q.query(`DROP TABLE jurisdictions`);
    await q.query(`DROP TABLE trailers`);
    await q.query(`DROP TABLE tractors`);
  }
}
