import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { environment } from '../config/app-config';
import { typeormOptions } from './typeorm-options';

/** Runs every pending migration in one transaction. Used by `npm start` and by the test setup. */
export async function runMigrations(url: string): Promise<string[]> {
  const ds = new DataSource(typeormOptions(url));
  await ds.initialize();
  try {
    const done = await ds.runMigrations({ transaction: 'all' });
    return done.map((m) => m.name);
  } finally {
    await ds.destroy();
  }
}

if (require.main === module) {
  // no default here: migrating must name its database
  const url = environment().DATABASE_URL;
  if (!url) {
    console.error('DATABASE_URL is not set');
    process.exit(2);
  }
  runMigrations(url)
    .then((names) => console.log(names.length ? `migrations applied: ${names.join(', ')}` : 'migrations: up to date'))
    .catch((err) => {
      console.error('migration failed:', err.message);
      process.exit(1);
    });
}
