import type { MigrationInterface, QueryRunner } from 'typeorm';

export class EscortsAndMail1764640000000 implements MigrationInterface {
  name = 'EscortsAndMail1764640000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE vendors (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        company varchar(120) NOT NULL,
        contact_name varchar(120) NOT NULL,
        email varchar(254) NOT NULL,
        phone varchar(40) NOT NULL,
        states varchar(2)[] NOT NULL DEFAULT '{}',
        operators jsonb NOT NULL DEFAULT '[]'::jsonb,
        insurance jsonb NOT NULL,
        vehicles jsonb NOT NULL DEFAULT '[]'::jsonb,
        rates jsonb NOT NULL,
        notes text,
        active boolean NOT NULL DEFAULT true,
        version int NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX vendors_states_idx ON vendors USING gin (states)`);
    await q.query(`
      CREATE TABLE escort_bookings (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        move_id uuid NOT NULL REFERENCES moves(id),
        vendor_id uuid NOT NULL REFERENCES vendors(id),
        position varchar(20) NOT NULL CHECK (position IN ('lead','chase','height_pole')),
        seat int NOT NULL CHECK (seat BETWEEN 1 AND 9),
        jurisdictions varchar(2)[] NOT NULL,
        start_date date NOT NULL,
        end_date date NOT NULL,
        meeting_point varchar(300) NOT NULL,
        meeting_time varchar(5),
        notes text,
        status varchar(20) NOT NULL DEFAULT 'requested'
          CHECK (status IN ('requested','confirmed','declined','proposed','cancelled')),
        request_summary jsonb NOT NULL,
        warnings jsonb NOT NULL DEFAULT '[]'::jsonb,
        answer jsonb,
        cancel_reason text,
        requested_by uuid REFERENCES users(id),
        requested_at timestamptz NOT NULL DEFAULT now(),
        responded_at timestamptz,
        reminder_sent_at timestamptz,
        departure_reminder_sent_at timestamptz,
        plan_revision int NOT NULL,
        version int NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK (end_date >= start_date)
      )`);
    await q.query(`CREATE INDEX escort_bookings_move_idx ON escort_bookings (move_id)`);
    await q.query(`CREATE INDEX escort_bookings_open_idx ON escort_bookings (status, requested_at) WHERE status IN ('requested','confirmed')`);
    // only the SHA-256 of a link's token is kept; the token itself exists only in the e-mail
    await q.query(`
      CREATE TABLE escort_response_tokens (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        booking_id uuid NOT NULL REFERENCES escort_bookings(id),
        token_hash char(64) NOT NULL UNIQUE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX escort_response_tokens_booking_idx ON escort_response_tokens (booking_id)`);
    await q.query(`
      CREATE TABLE mail_outbox (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        channel varchar(80) NOT NULL DEFAULT 'default',
        to_addresses varchar(254)[] NOT NULL,
        subject varchar(300) NOT NULL,
        text_body text NOT NULL,
        html_body text,
        attachments jsonb NOT NULL DEFAULT '[]'::jsonb,
        dedupe_key varchar(200) UNIQUE,
        related_entity varchar(40),
        related_id uuid,
        status varchar(10) NOT NULL DEFAULT 'pending' CHECK (status IN ('pending','sent','failed')),
        attempts int NOT NULL DEFAULT 0,
        next_attempt_at timestamptz NOT NULL DEFAULT now(),
        last_error text,
        smtp_message_id varchar(300),
        smtp_response text,
        sent_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX mail_outbox_due_idx ON mail_outbox (channel, next_attempt_at) WHERE status = 'pending'`);
    await q.query(`CREATE INDEX mail_outbox_related_idx ON mail_outbox (related_entity, related_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE mail_outbox`);
    await q.query(`DROP TABLE escort_response_tokens`);
    await q.query(`DROP TABLE escort_bookings`);
    await q.query(`DROP TABLE vendors`);
  }
}
