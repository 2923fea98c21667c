import * as bcrypt from 'bcryptjs';
import type { Role } from '@amberline/common';
import type { Db } from '../db';

export type SeedUserInput = { email?: string; name?: string; role?: Role; password?: string; active?: boolean };
export type SeededUser = { id: string; email: string; name: string; role: Role; password: string };

let counter = 0;
const unique = () => `${Date.now().toString(36)}${process.pid.toString(36)}${(counter++).toString(36)}`;

/** Inserts one user. Defaults are unique per call, so tests can run side by side on one database. */
export async function seedUser(db: Db, input: SeedUserInput = {}): Promise<SeededUser> {
  const role = input.role ?? 'dispatcher';
  const email = (input.email ?? `${role}.${unique()}@test.amberline.example`).toLowerCase();
  const name = input.name ?? `Test ${role.replace('_', ' ')}`;
  const password = input.password ?? 'correct-horse-battery';
  // cost 10 is the floor we accept; the server itself hashes at 12
  const hash = await bcrypt.hash(password, 10);
  const [row] = await db.query(
    `INSERT INTO users (email, name, role, password_hash, active) VALUES ($1, $2, $3, $4, $5) RETURNING id`,
    [email, name, role, hash, input.active ?? true],
  );
  return { id: row.id, email, name, role, password };
}

/** Many users at once (one bcrypt hash shared by all: bulk data for benchmarks, never for real accounts). */
export async function seedUsersBulk(db: Db, counts: Partial<Record<Role, number>>, tag: string, password = 'bench-password'): Promise<{ id: string; role: Role }[]> {
  const hash = await bcrypt.hash(password, 10);
  const out: { id: string; role: Role }[] = [];
  for (const [role, n] of Object.entries(counts) as [Role, number][]) {
    const rows = await db.query(
      `INSERT INTO users (email, name, role, password_hash)
       SELECT $1 || '.' || g || '@' || $2 || '.amberline.example', initcap($1) || ' ' || g, $1, $3 FROM generate_series(1, $4::int) g
       RETURNING id, role`,
      [role, tag, hash, n],
    );
    out.push(...rows);
  }
  return out;
}
