import { Pool } from 'pg';
import { PartitionManager, monthStartMs, nextMonthStartMs, partitionName } from '../../server/ingest/partitions';
import { insertReadings, type StoredReading } from '../../server/ingest/store';
import { isSilent } from '../../server/telemetry/liveness';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { countRows, createDevice, createPlacement, type TestDevice } from './support/telemetry-fixture';

describe('storage: monthly partitions, retention and liveness', () => {
  let db: TestDatabase;
  let pool: Pool;
  let device: TestDevice;

  const partitionsOf = async (table: string): Promise<string[]> =>
    (
      await db.dataSource.query(
        `SELECT c.relname AS name FROM pg_inherits i JOIN pg_class c ON c.oid = i.inhrelid JOIN pg_class p ON p.oid = i.inhparent WHERE p.relname = $1 ORDER BY 1`,
        [table],
      )
    ).map((row: { name: string }) => row.name);

  const reading = (atMs: number, seq: number): StoredReading => ({
    deviceId: device.deviceId,
    sensorId: device.sensorId,
    applianceId: device.applianceId,
    seq,
    atMs,
    freshFoodC: 3,
    freezerC: -18,
    freshFoodFlag: null,
    freezerFlag: null,
    batteryV: null,
    doorOpen: null,
  });

  beforeAll(async () => {
    db = await createTestDatabase();
    pool = new Pool({ connectionString: db.url, max: 2 });
    device = await createDevice(db.dataSource, await createPlacement(db.dataSource));
  }, 30_000);

  afterAll(async () => {
    await pool?.end();
    await db?.drop();
  });

  it('names months in UTC and steps across a year end', () => {
    const december = Date.UTC(2025, 11, 1);
    expect(monthStartMs(Date.UTC(2025, 11, 31, 23, 59))).toBe(december);
    expect(nextMonthStartMs(december)).toBe(Date.UTC(2026, 0, 1));
    expect(partitionName('reading', december)).toBe('reading_y2025m12');
  });

  it('creates the current month and two ahead, for readings and 5-minute rollups', async () => {
    const manager = new PartitionManager(pool);
    await manager.ensureAhead(Date.UTC(2026, 10, 15));
    await manager.ensureAhead(Date.UTC(2026, 10, 20));
    expect(await partitionsOf('reading')).toEqual(jasmine.arrayContaining(['reading_y2026m11', 'reading_y2026m12', 'reading_y2027m01']));
    expect(await partitionsOf('reading_rollup_5m')).toEqual(jasmine.arrayContaining(['reading_rollup_5m_y2026m11', 'reading_rollup_5m_y2026m12', 'reading_rollup_5m_y2027m01']));
  });

  it('creates a month on demand for a late reading, from two workers at once', async () => {
    const lateMs = Date.UTC(2024, 6, 4, 12);
    const [first, second] = [new PartitionManager(pool), new PartitionManager(pool)];
    await Promise.all([first.ensureFor(pool, [lateMs]), second.ensureFor(pool, [lateMs])]);
    const client = await pool.connect();
    try {
      expect(await insertReadings(client, [reading(lateMs, 1)])).toBe(1);
      expect(await insertReadings(client, [reading(lateMs, 1)])).toBe(0);
    } finally {
      client.release();
    }
    // Written outside the live ingest (a logger file, the seed): seen, but not heard from the sensor.
    const [sensor] = await pool.query('SELECT last_seen_at, last_heard_at FROM sensor WHERE id = $1', [device.sensorId]).then((result) => result.rows);
    expect(new Date(sensor.last_seen_at).getTime()).toBeGreaterThanOrEqual(lateMs);
    expect(sensor.last_heard_at).toBeNull();
    expect(await partitionsOf('reading')).toContain('reading_y2024m07');
  });

  it('drops whole months past the retention but keeps the hourly rollups', async () => {
    const manager = new PartitionManager(pool);
    const oldMs = Date.UTC(2023, 2, 10);
    const keptMs = Date.UTC(2023, 3, 10);
    await manager.ensureFor(pool, [oldMs, keptMs]);
    const client = await pool.connect();
    try {
      await insertReadings(client, [reading(oldMs, 10), reading(keptMs, 11)]);
    } finally {
      client.release();
    }
    const dropped = await manager.dropOlderThan(Date.UTC(2023, 3, 5));
    expect(dropped.sort()).toEqual(['reading_rollup_5m_y2023m03', 'reading_y2023m03']);
    expect(await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading WHERE at < $1', [new Date(Date.UTC(2023, 5, 1))])).toBe(1);
    expect(await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading_rollup_1h WHERE bucket < $1', [new Date(Date.UTC(2023, 5, 1))])).toBe(2);
  });

  it('calls a sensor silent after three of its intervals without a reading', () => {
    const nowMs = Date.UTC(2026, 0, 1, 12);
    expect(isSilent(nowMs - 15 * 60_000, 300, nowMs)).toBeFalse();
    expect(isSilent(nowMs - 15 * 60_000 - 1, 300, nowMs)).toBeTrue();
    expect(isSilent(null, 300, nowMs)).toBeTrue();
  });
});
