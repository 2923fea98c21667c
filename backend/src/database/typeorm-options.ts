import type { DataSourceOptions } from 'typeorm';
import { MIGRATIONS } from './migrations';

/** Options shared by the Nest app, the TypeORM CLI data source and the migration runner. */
export function typeormOptions(url: string): DataSourceOptions {
  return {
    type: 'postgres',
    url,
    synchronize: false,
    migrations: MIGRATIONS,
    migrationsTableName: 'migrations',
    migrationsTransactionMode: 'all',
    extra: { max: 20 },
  };
}
