/**
 * The telemetry contract between a sensor, the broker and the ingest: topic layout and
 * the reading payload. The JSON Schema in shared/telemetry.schema.json is generated from
 * `readingPayloadSchema` (`npm run` … see broker/README.md) and a spec keeps them equal.
 */
import { z } from 'zod';

/**
 * Logical shards of the topic space. Fixed for the life of topic version v1: a sensor's
 * shard never changes, and ingest workers are given disjoint sets of shards (64 shards
 * leave room for up to 64 workers without moving a single sensor).
 */
export const SHARD_COUNT = 64;
export const TOPIC_ROOT = 'cw/v1/s';

/** Device ids double as MQTT client ids and topic levels: no '/', '+', '#' or spaces. */
export const DEVICE_ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9_-]{2,47}$/;

/** Plausible range of a cabinet probe; anything outside is rejected unless it is a known error value. */
export const PROBE_VALID_MIN_C = -60;
export const PROBE_VALID_MAX_C = 60;

/**
 * Values a digital probe reports when something is wrong, stored as a flag instead of a
 * temperature. 85 °C is the DS18B20's power-on reset value of its temperature register
 * (Maxim DS18B20 datasheet, "Operation — Measuring Temperature"); −127 °C is what the
 * widely used 1-Wire driver libraries return for a disconnected probe (common practice).
 */
export const PROBE_ERROR_VALUES = { disconnected: -127, 'power-on': 85 } as const;
export type ProbeErrorFlag = keyof typeof PROBE_ERROR_VALUES;

/** Largest payload the ingest accepts; a reading is about 150 bytes. */
export const MAX_READING_PAYLOAD_BYTES = 4096;

/** 32-bit FNV-1a over the bytes of an ASCII device id (check values "a" → e40c292c and "foobar" → bf9cf968 from the FNV test vectors of draft-eastlake-fnv). */
export function fnv1a32(text: string): number {
  let hash = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    hash ^= text.charCodeAt(i) & 0xff;
    hash = Math.imul(hash, 0x01000193) >>> 0;
  }
  return hash >>> 0;
}

export function shardOf(deviceId: string): number {
  return fnv1a32(deviceId) % SHARD_COUNT;
}

/** The one topic a sensor may publish readings to: cw/v1/s/<shard>/<deviceId>/reading. */
export function readingTopic(deviceId: string): string {
  return `${TOPIC_ROOT}/${shardOf(deviceId)}/${deviceId}/reading`;
}

/** The subscription an ingest worker makes for one shard it owns. */
export function shardFilter(shard: number): string {
  return `${TOPIC_ROOT}/${shard}/+/reading`;
}

export interface ReadingTopic {
  shard: number;
  deviceId: string;
}

/** Parses a reading topic; null when it is not one, or its shard does not match its device id. */
export function parseReadingTopic(topic: string): ReadingTopic | null {
  const parts = topic.split('/');
  if (parts.length !== 6 || `${parts[0]}/${parts[1]}/${parts[2]}` !== TOPIC_ROOT || parts[5] !== 'reading') return null;
  const deviceId = parts[4];
  if (!DEVICE_ID_PATTERN.test(deviceId)) return null;
  const shard = Number(parts[3]);
  if (String(shard) !== parts[3] || shard !== shardOf(deviceId)) return null;
  return { shard, deviceId };
}

/** One probe value in °C; null (or absent) when the probe has nothing to report. */
const probeValueC = z.number().nullable().optional().describe('temperature in degrees Celsius, or null');

/** A reading as a sensor publishes it (JSON, UTF-8, QoS 1, not retained). */
export const readingPayloadSchema = z
  .object({
    sensor: z.string().regex(DEVICE_ID_PATTERN).describe('device id; must equal the id in the topic'),
    seq: z.int().min(0).describe('per-sensor sequence number, incremented for every reading'),
    at: z.iso.datetime({ offset: true }).describe('time of the measurement, ISO 8601 with Z or an offset'),
    fresh_food: probeValueC,
    freezer: probeValueC,
    battery_v: z.number().min(0).max(10).optional().describe('battery voltage'),
    door: z.enum(['open', 'closed']).optional().describe('door switch state at the measurement'),
  })
  .refine((reading) => reading.fresh_food !== undefined || reading.freezer !== undefined, {
    message: 'a reading carries at least one probe (fresh_food or freezer)',
  })
  .describe('Chillwarden sensor reading, topic cw/v1/s/<shard>/<sensor>/reading');

export type ReadingPayload = z.infer<typeof readingPayloadSchema>;

/** The JSON Schema of the payload, as committed in shared/telemetry.schema.json. */
export function readingPayloadJsonSchema(): Record<string, unknown> {
  return {
    $id: 'https://chillwarden.example.com/schemas/telemetry/v1/reading.json',
    ...z.toJSONSchema(readingPayloadSchema, { io: 'input' }),
  };
}
