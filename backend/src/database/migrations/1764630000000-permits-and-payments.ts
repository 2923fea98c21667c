import type { MigrationInterface, QueryRunner } from 'typeorm';

export class PermitsAndPayments1764630000000 implements MigrationInterface {
  name = 'PermitsAndPayments1764630000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE permits (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        move_id uuid NOT NULL REFERENCES moves(id),
        jurisdiction varchar(2) NOT NULL,
        permit_type varchar(20) NOT NULL DEFAULT 'single_trip'
          CHECK (permit_type IN ('single_trip','annual','blanket','superload')),
        status varchar(20) NOT NULL DEFAULT 'to_file'
          CHECK (status IN ('to_file','filed','issued','rejected','needs_amendment','void')),
        needed boolean NOT NULL DEFAULT true,
        permit_number varchar(60),
        filed_at timestamptz,
        issued_at timestamptz,
        valid_from timestamptz,
        valid_to timestamptz,
        permitted jsonb,
        route_text text,
        conditions jsonb NOT NULL DEFAULT '{}'::jsonb,
        conditions_text text,
        estimated_fee_cents int CHECK (estimated_fee_cents >= 0),
        actual_fee_cents int CHECK (actual_fee_cents > 0),
        refundable boolean,
        rule_version int,
        lead_time_days int NOT NULL DEFAULT 2,
        assignee_id uuid REFERENCES users(id),
        notes text,
        amendment_reason text,
        expiry_warning text,
        expiry_checked_at timestamptz,
        version int NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK (valid_to IS NULL OR valid_from IS NULL OR valid_to > valid_from)
      )`);
    // one live permit per move and jurisdiction; voided ones stay as history
    await q.query(`CREATE UNIQUE INDEX permits_live_per_move ON permits (move_id, jurisdiction) WHERE status <> 'void'`);
    await q.query(`CREATE INDEX permits_status ON permits (status)`);
    await q.query(`CREATE INDEX permits_assignee ON permits (assignee_id)`);
    await q.query(`
      CREATE TABLE permit_versions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        permit_id uuid NOT NULL REFERENCES permits(id),
        version int NOT NULL,
        status varchar(20) NOT NULL,
        snapshot jsonb NOT NULL,
        reason text,
        created_by uuid REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (permit_id, version)
      )`);
    await q.query(`
      CREATE TABLE permit_documents (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        permit_id uuid NOT NULL REFERENCES permits(id),
        version int NOT NULL,
        file_name varchar(160) NOT NULL,
        sha256 char(64) NOT NULL,
        size_bytes int NOT NULL CHECK (size_bytes > 0),
        content_type varchar(60) NOT NULL DEFAULT 'application/pdf',
        storage_key varchar(200) NOT NULL,
        uploaded_by uuid REFERENCES users(id),
        uploaded_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (permit_id, version),
        UNIQUE (permit_id, sha256)
      )`);
    await q.query(`
      CREATE TABLE permit_payments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        permit_id uuid NOT NULL REFERENCES permits(id),
        move_id uuid NOT NULL REFERENCES moves(id),
        attempt int NOT NULL,
        client_key varchar(100) NOT NULL,
        idempotency_key varchar(160) NOT NULL UNIQUE,
        amount_cents int NOT NULL CHECK (amount_cents > 0),
        currency char(3) NOT NULL DEFAULT 'usd',
        status varchar(20) NOT NULL DEFAULT 'pending'
          CHECK (status IN ('pending','processing','succeeded','declined','failed','canceled','refunded')),
        payment_method varchar(80) NOT NULL,
        stripe_payment_intent_id varchar(100) UNIQUE,
        stripe_charge_id varchar(100),
        stripe_refund_id varchar(100),
        decline_code varchar(60),
        failure_message text,
        created_by uuid REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        succeeded_at timestamptz,
        refunded_at timestamptz,
        UNIQUE (permit_id, attempt),
        UNIQUE (permit_id, client_key)
      )`);
    await q.query(`CREATE INDEX permit_payments_move ON permit_payments (move_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE permit_payments`);
    await q.query(`DROP TABLE permit_documents`);
    await q.query(`DROP TABLE permit_versions`);
    await q.query(`DROP TABLE permits`);
  }
}
