import type { Pool, PoolClient } from 'pg';
import type { RejectReason } from '../../shared/api/telemetry';

/** One message (or one probe value) turned away, by the broker or by the ingest. */
export interface RejectEntry {
  source: 'broker' | 'ingest';
  reason: RejectReason;
  atMs: number;
  sensorId: string | null;
  deviceId: string | null;
  topic: string | null;
  detail: string;
  payloadExcerpt: string | null;
}

/** Sample rows kept per (device, reason) in one write: a flood is counted, not stored. */
const SAMPLES_PER_KEY = 3;
const EXCERPT_BYTES = 160;

/** The start of a payload, printable, for the sensor page. */
export function payloadExcerpt(payload: Buffer): string {
  const text = payload.subarray(0, EXCERPT_BYTES).toString('utf8');
  // eslint-disable-next-line no-control-regex
  const printable = text.replace(/[\u0000-\u0008\u000b-\u001f\u007f\ufffd]/g, '·');
  return payload.length > EXCERPT_BYTES ? `${printable}…` : printable;
}

/** PostgreSQL text cannot hold U+0000, and a topic or device id from the wire may. */
const storable = (text: string | null) => (text === null ? null : text.replace(/\u0000/g, '·'));

function sampled(entries: RejectEntry[]): RejectEntry[] {
  const seen = new Map<string, number>();
  return entries.filter((entry) => {
    const key = `${entry.sensorId ?? entry.deviceId ?? ''}|${entry.reason}`;
    const count = (seen.get(key) ?? 0) + 1;
    seen.set(key, count);
    return count <= SAMPLES_PER_KEY;
  });
}

const INSERT_SAMPLES = `
  INSERT INTO telemetry_reject (source, reason, sensor_id, device_id, topic, detail, payload_excerpt, at)
  SELECT * FROM unnest($1::text[], $2::text[], $3::uuid[], $4::text[], $5::text[], $6::text[], $7::text[], $8::timestamptz[])`;

const UPSERT_COUNTS = `
  INSERT INTO telemetry_reject_count AS c (reason, sensor_id, count, last_at)
  SELECT reason, sensor_id, count(*), max(at)
  FROM unnest($1::text[], $2::uuid[], $3::timestamptz[]) AS r(reason, sensor_id, at)
  GROUP BY reason, sensor_id
  ON CONFLICT (reason, sensor_id) DO UPDATE
    SET count = c.count + EXCLUDED.count, last_at = GREATEST(c.last_at, EXCLUDED.last_at)`;

/** Counts every entry per reason and sensor, and keeps a few samples of each. */
export async function writeRejects(db: Pool | PoolClient, entries: RejectEntry[]): Promise<void> {
  if (!entries.length) return;
  const samples = sampled(entries);
  await db.query(INSERT_SAMPLES, [
    samples.map((e) => e.source),
    samples.map((e) => e.reason),
    samples.map((e) => e.sensorId),
    samples.map((e) => storable(e.deviceId)),
    samples.map((e) => storable(e.topic)),
    samples.map((e) => storable(e.detail)),
    samples.map((e) => storable(e.payloadExcerpt)),
    samples.map((e) => new Date(e.atMs)),
  ]);
  await db.query(UPSERT_COUNTS, [entries.map((e) => e.reason), entries.map((e) => e.sensorId), entries.map((e) => new Date(e.atMs))]);
}

/** Keeps the sample table small: 30 days, at most `perSensor` rows per sensor. */
export async function trimRejects(db: Pool, perSensor = 50, maxAgeDays = 30): Promise<void> {
  await db.query(`DELETE FROM telemetry_reject WHERE at < now() - make_interval(days => $1)`, [maxAgeDays]);
  await db.query(
    `DELETE FROM telemetry_reject WHERE id IN (
       SELECT id FROM (
         SELECT id, row_number() OVER (PARTITION BY sensor_id ORDER BY at DESC, id DESC) AS rank FROM telemetry_reject
       ) ranked WHERE rank > $1)`,
    [perSensor],
  );
}
