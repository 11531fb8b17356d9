import type { Pool, PoolClient } from 'pg';

/**
 * Monthly range partitions (UTC) of the readings and of the 5-minute rollups. A month is
 * created ahead by the maintenance job and on demand when a batch (a backfill, a sensor
 * that was offline) reaches a month without one. No default partition: a row in it would
 * block creating the month's real partition later.
 */
export const PARTITIONED_TABLES = ['reading', 'reading_rollup_5m'] as const;
type PartitionedTable = (typeof PARTITIONED_TABLES)[number];

/** One advisory-lock key for all partition DDL, so concurrent workers never race on CREATE. */
const PARTITION_LOCK_KEY = 0x63770001;

export function monthStartMs(atMs: number): number {
  const at = new Date(atMs);
  return Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), 1);
}

export function nextMonthStartMs(monthMs: number): number {
  const at = new Date(monthMs);
  return Date.UTC(at.getUTCFullYear(), at.getUTCMonth() + 1, 1);
}

export function partitionName(table: PartitionedTable, monthMs: number): string {
  const at = new Date(monthMs);
  return `${table}_y${at.getUTCFullYear()}m${String(at.getUTCMonth() + 1).padStart(2, '0')}`;
}

function parseMonth(name: string, table: PartitionedTable): number | null {
  const match = new RegExp(`^${table}_y(\\d{4})m(\\d{2})$`).exec(name);
  return match ? Date.UTC(Number(match[1]), Number(match[2]) - 1, 1) : null;
}

export class PartitionManager {
  /** Months known to exist (both tables), so the hot path asks the database only for new months. */
  private readonly known = new Set<number>();

  constructor(private readonly pool: Pool) {}

  /** Ensures partitions for every month that holds one of the given times. */
  async ensureFor(client: Pool | PoolClient, timesMs: Iterable<number>): Promise<void> {
    const missing = new Set<number>();
    for (const atMs of timesMs) {
      const month = monthStartMs(atMs);
      if (!this.known.has(month)) missing.add(month);
    }
    if (missing.size) await this.create([...missing], client);
  }

  /** The current month and `monthsAhead` after it. */
  async ensureAhead(nowMs: number, monthsAhead = 2): Promise<void> {
    const months = [monthStartMs(nowMs)];
    for (let i = 0; i < monthsAhead; i++) months.push(nextMonthStartMs(months[months.length - 1]));
    await this.create(months.filter((month) => !this.known.has(month)), this.pool);
  }

  private async create(months: number[], db: Pool | PoolClient): Promise<void> {
    if (!months.length) return;
    const client = 'release' in db ? db : await db.connect();
    const ownClient = client !== db;
    try {
      await client.query('BEGIN');
      await client.query('SELECT pg_advisory_xact_lock($1)', [PARTITION_LOCK_KEY]);
      for (const month of months) {
        for (const table of PARTITIONED_TABLES) await client.query(createPartitionSql(table, month));
      }
      await client.query('COMMIT');
    } catch (error) {
      await client.query('ROLLBACK').catch(() => undefined);
      throw error;
    } finally {
      if (ownClient) client.release();
    }
    months.forEach((month) => this.known.add(month));
  }

  /**
   * Drops whole months of raw readings and 5-minute rollups that ended before the
   * retention horizon. Hourly rollups are kept: they are small and feed multi-year charts.
   */
  async dropOlderThan(horizonMs: number): Promise<string[]> {
    const dropped: string[] = [];
    for (const table of PARTITIONED_TABLES) {
      const { rows } = await this.pool.query<{ name: string }>(
        `SELECT c.relname AS name FROM pg_inherits i JOIN pg_class c ON c.oid = i.inhrelid
         JOIN pg_class p ON p.oid = i.inhparent WHERE p.relname = $1`,
        [table],
      );
      for (const { name } of rows) {
        const month = parseMonth(name, table);
        if (month === null || nextMonthStartMs(month) > horizonMs) continue;
        await this.pool.query(`DROP TABLE IF EXISTS ${name}`);
        this.known.delete(month);
        dropped.push(name);
      }
    }
    return dropped;
  }
}

function createPartitionSql(table: PartitionedTable, monthMs: number): string {
  const from = new Date(monthMs).toISOString();
  const to = new Date(nextMonthStartMs(monthMs)).toISOString();
  return `CREATE TABLE IF NOT EXISTS ${partitionName(table, monthMs)} PARTITION OF ${table} FOR VALUES FROM ('${from}') TO ('${to}')`;
}
