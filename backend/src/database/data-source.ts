import 'reflect-metadata';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { typeormOptions } from './typeorm-options';

/** Standalone data source for the TypeORM CLI: `npm run typeorm -w backend -- migration:show`. */
export default new DataSource({
  ...typeormOptions(process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/amberline'),
  entities: [join(__dirname, '..', '**', '*.entity.js')],
});
