import type { MigrationInterface, QueryRunner } from 'typeorm';

export class UsersAndSignIn1764610000000 implements MigrationInterface {
  name = 'UsersAndSignIn1764610000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS pgcrypto`);
    await q.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email varchar(254) NOT NULL,
        name varchar(120) NOT NULL,
        role varchar(20) NOT NULL CHECK (role IN ('admin','dispatcher','permit_clerk','driver')),
        password_hash varchar(100) NOT NULL,
        active boolean NOT NULL DEFAULT true,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX users_email_key ON users (lower(email))`);
    await q.query(`CREATE INDEX users_role_idx ON users (role, name)`);
    await q.query(`
      CREATE TABLE login_failures (
        id bigserial PRIMARY KEY,
        email varchar(254) NOT NULL,
        ip varchar(64) NOT NULL,
        at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX login_failures_email_at_idx ON login_failures (email, at)`);
    await q.query(`CREATE INDEX login_failures_ip_at_idx ON login_failures (ip, at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE login_failures`);
    await q.query(`DROP TABLE users`);
  }
}
