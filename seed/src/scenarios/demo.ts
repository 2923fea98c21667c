import type { Db } from '../db';
import { seedUser } from '../builders/user';

/** The demo scenario: Tamarack Ridge Heavy Haul, an invented carrier. Every name here is made up. */
export const DEMO_PASSWORD = 'amberline-demo';
export const DEMO_USERS = [
  { email: 'admin@amberline.example', name: 'Rowan Vale', role: 'admin' },
  { email: 'dispatcher@amberline.example', name: 'Dana Okafor-Pell', role: 'dispatcher' },
  { email: 'clerk@amberline.example', name: 'Imogen Strand', role: 'permit_clerk' },
  { email: 'driver@amberline.example', name: 'Cal Brennick', role: 'driver' },
] as const;

export async function seedDemo(db: Db): Promise<{ users: number }> {
  for (const u of DEMO_USERS) await seedUser(db, { ...u, password: DEMO_PASSWORD });
  return { users: DEMO_USERS.length };
}
