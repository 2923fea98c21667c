import { runMigrations } from '../src/database/migrate';

/** test.sh migrates the fresh test database before jest starts; this makes a run of one file work too (a no-op when up to date). */
export default async function globalSetup(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url || !/amberline_test/.test(url)) throw new Error('DATABASE_URL must point at the test database (run tests with npm test)');
  await runMigrations(url);
}
