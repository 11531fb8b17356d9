/**
 * Backfilled readings written straight into the readings table, bypassing MQTT: the seeded
 * history is months of five-minute readings for every appliance, which the broker path would
 * take minutes to carry. Rows are exactly what the ingest would store for the same payloads
 * (probe error values as flags, values rounded to 0.0001 °C), written by its own statement.
 */
import type { DataSource } from 'typeorm';
import type { PoolClient } from 'pg';
import { insertReadings, type StoredReading } from '../../server/ingest/store';
import { monthStartMs, nextMonthStartMs, partitionName, PARTITIONED_TABLES } from '../../server/ingest/partitions';
import { PROBE_ERROR_VALUES, type ProbeErrorFlag } from '../../shared/telemetry';
import type { SimSample } from '../../simulator/model';

/** Rows per statement: fewer, larger statements cost the database less (21 s of backend CPU for the demo at 40,000, 24 s at 12,000). */
const CHUNK_ROWS = 40_000;

const roundC = (valueC: number) => Math.round(valueC * 10_000) / 10_000;

function flagOf(valueC: number | null): ProbeErrorFlag | null {
  if (valueC === PROBE_ERROR_VALUES.disconnected) return 'disconnected';
  if (valueC === PROBE_ERROR_VALUES['power-on']) return 'power-on';
  return null;
}

const storedC = (valueC: number | null, flag: ProbeErrorFlag | null) => (valueC === null || flag ? null : roundC(valueC));

export interface SensorIds {
  deviceId: string;
  sensorId: string;
  applianceId: string;
}

/** The row the ingest would store for one simulated sample. */
export function storedReadingOf(sample: SimSample, seq: number, ids: SensorIds): StoredReading {
  const freshFoodFlag = flagOf(sample.freshFoodC);
  const freezerFlag = flagOf(sample.freezerC);
  return {
    deviceId: ids.deviceId,
    sensorId: ids.sensorId,
    applianceId: ids.applianceId,
    seq,
    atMs: sample.atMs,
    freshFoodC: storedC(sample.freshFoodC, freshFoodFlag),
    freezerC: storedC(sample.freezerC, freezerFlag),
    freshFoodFlag,
    freezerFlag,
    batteryV: roundC(sample.batteryV),
    doorOpen: sample.doorOpen,
  };
}

/** Monthly partitions of the readings and 5-minute rollups for every month in [fromMs, toMs]. */
export async function ensurePartitions(dataSource: DataSource, fromMs: number, toMs: number): Promise<void> {
  for (let month = monthStartMs(fromMs); month <= toMs; month = nextMonthStartMs(month)) {
    const from = new Date(month).toISOString();
    const to = new Date(nextMonthStartMs(month)).toISOString();
    for (const table of PARTITIONED_TABLES) {
      await dataSource.query(`CREATE TABLE IF NOT EXISTS ${partitionName(table, month)} PARTITION OF ${table} FOR VALUES FROM ('${from}') TO ('${to}')`);
    }
  }
}

/**
 * Writes readings with the ingest's own statement (server/ingest/store.ts): the rows, their
 * 5-minute and hourly rollups and the sensors' last-seen times, in chunks on one connection.
 */
export async function insertReadingsInChunks(dataSource: DataSource, readings: readonly StoredReading[]): Promise<void> {
  const runner = dataSource.createQueryRunner();
  try {
    const client = (await runner.connect()) as PoolClient;
    for (let start = 0; start < readings.length; start += CHUNK_ROWS) await insertReadings(client, readings.slice(start, start + CHUNK_ROWS));
  } finally {
    await runner.release();
  }
}

export async function analyzeReadings(dataSource: DataSource): Promise<void> {
  await dataSource.query('ANALYZE reading, reading_rollup_5m, reading_rollup_1h');
}
