import 'reflect-metadata';
import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../../server/db/options';

/**
 * A throwaway database on the project's PostgreSQL, migrated from scratch. The test
 * runner starts PostgreSQL and sets TEST_PG_ADMIN_URL; each spec file that needs a
 * database creates its own and drops it afterwards.
 */
export const ADMIN_URL = process.env.TEST_PG_ADMIN_URL ?? 'postgres://postgres@127.0.0.1:55432/postgres';

export interface TestDatabase {
  name: string;
  url: string;
  dataSource: DataSource;
  drop(): Promise<void>;
}

async function admin<T>(work: (client: Client) => Promise<T>): Promise<T> {
  const client = new Client({ connectionString: ADMIN_URL });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

export function urlFor(database: string): string {
  const url = new URL(ADMIN_URL);
  url.pathname = `/${database}`;
  return url.toString();
}

export async function createTestDatabase(prefix = 'cw_test'): Promise<TestDatabase> {
  const name = `${prefix}_${randomBytes(5).toString('hex')}`;
  await admin((client) => client.query(`CREATE DATABASE ${name}`));
  const url = urlFor(name);
  const dataSource = new DataSource(dataSourceOptions(url));
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'each' });
  return {
    name,
    url,
    dataSource,
    async drop() {
      if (dataSource.isInitialized) await dataSource.destroy();
      await admin((client) => client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
    },
  };
}
