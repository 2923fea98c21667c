import 'reflect-metadata';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { readAppConfig } from '../config/app-config';
import { typeormOptions } from './typeorm-options';

/** Standalone data source for the TypeORM CLI: `npm run typeorm -w backend -- migration:show`. */
export default new DataSource({
  ...typeormOptions(readAppConfig().databaseUrl),
  entities: [join(__dirname, '..', '**', '*.entity.js')],
});
