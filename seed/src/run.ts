import { connectPg } from './db';
import { seedDemo } from './scenarios/demo';

/** `node dist/run.js demo`: loads the demo scenario into an empty database (migrations must have run). */
async function main(): Promise<void> {
  const scenario = process.argv[2] ?? 'demo';
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set');
  const db = await connectPg(url);
  try {
    if (scenario !== 'demo') throw new Error(`unknown scenario ${scenario}; try: demo`);
    const [{ n }] = await db.query('SELECT count(*)::int AS n FROM users');
    if (n > 0 && !process.argv.includes('--force')) {
      console.log(`seed: database already has ${n} users, demo scenario not loaded`);
      return;
    }
    await db.query('BEGIN');
    try {
      const r = await seedDemo(db);
      await db.query('COMMIT');
      console.log(`seed: demo scenario loaded (${JSON.stringify(r)})`);
    } catch (e) {
      await db.query('ROLLBACK');
      throw e;
    }
  } finally {
    await db.close();
  }
}
main().catch((e) => {
  console.error('seed failed:', e.message);
  process.exit(1);
});
