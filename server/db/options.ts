import type { DataSourceOptions } from 'typeorm';
import { ENTITIES } from '../entities';
import { MIGRATIONS } from '../migrations';

/** Options for the one data source; specs pass a throwaway database's URL. */
export function dataSourceOptions(url: string): DataSourceOptions {
  return {
    type: 'postgres',
    url,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsRun: false,
    synchronize: false,
    logging: false,
    extra: { max: Number(process.env.PG_POOL_MAX ?? 20), connectionTimeoutMillis: 5000 },
  };
}
