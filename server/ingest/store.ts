import type { PoolClient } from 'pg';
import type { ValidReading } from './validate';

/** A validated reading with the sensor and appliance it belongs to. */
export interface StoredReading extends ValidReading {
  sensorId: string;
  applianceId: string | null;
}

export interface InsertedKey {
  sensorId: string;
  atMs: number;
}

/** Buckets are aligned to this origin; date_bin keeps them independent of the session time zone. */
const BUCKET_ORIGIN = `TIMESTAMPTZ '2000-01-01 00:00:00+00'`;

function rollupUpsert(table: string, width: string): string {
  const merge = (probe: string) => `
      ${probe}_min = LEAST(t.${probe}_min, EXCLUDED.${probe}_min),
      ${probe}_max = GREATEST(t.${probe}_max, EXCLUDED.${probe}_max),
      ${probe}_sum = t.${probe}_sum + EXCLUDED.${probe}_sum,
      ${probe}_count = t.${probe}_count + EXCLUDED.${probe}_count`;
  return `
    INSERT INTO ${table} AS t (appliance_id, bucket,
      fresh_food_min, fresh_food_max, fresh_food_sum, fresh_food_count,
      freezer_min, freezer_max, freezer_sum, freezer_count, reading_count, door_open_count)
    SELECT appliance_id, date_bin('${width}', at, ${BUCKET_ORIGIN}) AS bucket,
      min(fresh_food_c), max(fresh_food_c), coalesce(sum(fresh_food_c::float8), 0), count(fresh_food_c),
      min(freezer_c), max(freezer_c), coalesce(sum(freezer_c::float8), 0), count(freezer_c),
      count(*), count(*) FILTER (WHERE door_open)
    FROM ins WHERE appliance_id IS NOT NULL
    GROUP BY 1, 2 ORDER BY 1, 2
    ON CONFLICT (appliance_id, bucket) DO UPDATE SET ${merge('fresh_food')}, ${merge('freezer')},
      reading_count = t.reading_count + EXCLUDED.reading_count,
      door_open_count = t.door_open_count + EXCLUDED.door_open_count`;
}

/**
 * One statement per batch: the readings (duplicates skipped by the (sensor_id, at) key),
 * the rollups of the rows actually inserted (so a redelivered message never counts twice),
 * and the sensors' last-seen time (newest reading). Live ingest also sets last-heard (this
 * commit); readings attached from a logger file were not heard from the sensor.
 */
const writeBatch = (heard: boolean) => `
  WITH ins AS (
    INSERT INTO reading (sensor_id, appliance_id, at, seq, fresh_food_c, freezer_c, fresh_food_flag, freezer_flag, battery_v, door_open)
    SELECT sensor_id, appliance_id, to_timestamp(at_ms / 1000), seq, fresh_food_c, freezer_c, fresh_food_flag, freezer_flag, battery_v, door_open
    FROM unnest($1::uuid[], $2::uuid[], $3::float8[], $4::bigint[], $5::real[], $6::real[], $7::text[], $8::text[], $9::real[], $10::boolean[])
      AS r(sensor_id, appliance_id, at_ms, seq, fresh_food_c, freezer_c, fresh_food_flag, freezer_flag, battery_v, door_open)
    ON CONFLICT DO NOTHING
    RETURNING sensor_id, appliance_id, at, fresh_food_c, freezer_c, door_open
  ),
  r5 AS (${rollupUpsert('reading_rollup_5m', '5 minutes')}),
  r1h AS (${rollupUpsert('reading_rollup_1h', '1 hour')}),
  seen AS (
    UPDATE sensor s SET last_seen_at = GREATEST(s.last_seen_at, m.max_at)${heard ? ', last_heard_at = now()' : ''}
    FROM (SELECT sensor_id, max(at) AS max_at FROM ins GROUP BY 1) m WHERE s.id = m.sensor_id
  )`;

const COUNT_INSERTED = `${writeBatch(false)} SELECT count(*)::int AS inserted FROM ins`;
const LIST_INSERTED = `${writeBatch(true)} SELECT sensor_id::text AS sensor_id, (extract(epoch FROM at) * 1000)::float8 AS at_ms FROM ins`;

type ArrayElement = string | number | boolean | null;

/** A text element quoted for an array literal (backslash and double quote escaped). */
const quoted = (text: string) => `"${text.replace(/[\\"]/g, '\\$&')}"`;

/**
 * One column as a PostgreSQL array literal. node-postgres would escape and convert every
 * element on its own (dates through local-time strings); a batch of thousands of readings
 * is cheaper written as one string, the times as epoch milliseconds.
 */
function arrayLiteral(values: ArrayElement[], asText = false): string {
  const items = values.map((value) => {
    if (value === null) return 'NULL';
    if (typeof value === 'boolean') return value ? 't' : 'f';
    return asText ? quoted(String(value)) : String(value);
  });
  return `{${items.join(',')}}`;
}

function columns(readings: StoredReading[]): string[] {
  return [
    arrayLiteral(readings.map((r) => r.sensorId)),
    arrayLiteral(readings.map((r) => r.applianceId)),
    arrayLiteral(readings.map((r) => r.atMs)),
    arrayLiteral(readings.map((r) => r.seq)),
    arrayLiteral(readings.map((r) => r.freshFoodC)),
    arrayLiteral(readings.map((r) => r.freezerC)),
    arrayLiteral(readings.map((r) => r.freshFoodFlag), true),
    arrayLiteral(readings.map((r) => r.freezerFlag), true),
    arrayLiteral(readings.map((r) => r.batteryV)),
    arrayLiteral(readings.map((r) => r.doorOpen)),
  ];
}

/** Writes one batch of readings not heard live (a logger file, a backfill) inside the caller's transaction; returns how many rows were new. */
export async function insertReadings(client: PoolClient, readings: StoredReading[]): Promise<number> {
  if (!readings.length) return 0;
  const { rows } = await client.query<{ inserted: number }>(COUNT_INSERTED, columns(readings));
  return rows[0].inserted;
}

/** The live ingest's write: like insertReadings, but the sensors count as heard now, and it names the rows that were new (for feeding detection). */
export async function insertReadingsListingNew(client: PoolClient, readings: StoredReading[]): Promise<InsertedKey[]> {
  if (!readings.length) return [];
  const { rows } = await client.query<{ sensor_id: string; at_ms: number }>(LIST_INSERTED, columns(readings));
  return rows.map((row) => ({ sensorId: row.sensor_id, atMs: row.at_ms }));
}
