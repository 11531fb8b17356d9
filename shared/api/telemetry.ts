/** Telemetry shapes the API answers: reject reasons, a sensor's rejects, an appliance's history. */
import type { Probe } from '../domain';

/**
 * Why a message never became a reading (or, for `sensor-error-value`, why one probe value
 * was stored as a flag instead of a temperature). Broker reasons come first.
 */
export const REJECT_REASONS = {
  'unknown-device': 'sign-in by a device id that is not registered',
  'wrong-secret': 'sign-in with a wrong secret',
  'client-id-mismatch': 'MQTT client id differs from the device id',
  'publish-denied': 'publish to a topic the device does not own',
  'subscribe-denied': 'subscription the account may not make',
  'payload-too-large': 'message larger than the broker accepts',
  'bad-topic': 'not a reading topic, or shard does not match the device id',
  'too-large': 'payload larger than a reading can be',
  'not-json': 'payload is not JSON',
  schema: 'payload does not match the reading schema',
  'topic-mismatch': 'sensor id in the payload differs from the topic',
  'out-of-range': 'temperature outside −60 … 60 °C',
  'sensor-error-value': 'probe reported a known error value (−127 or 85 °C), stored as a flag',
  'future-timestamp': 'reading time is ahead of the server clock',
  'too-old': 'reading time is older than the raw-reading retention',
  'unknown-sensor': 'no registered sensor has this device id',
  'store-error': 'the database refused this one reading (a data error); counted, not retried',
} as const;
export type RejectReason = keyof typeof REJECT_REASONS;

/**
 * Sensor liveness: a sensor that has not reported for longer than this many of its own
 * intervals is `silent` (issue: "longer than 3 of its intervals").
 */
export const SILENT_AFTER_INTERVALS = 3;

export function isSilent(lastSeenAtMs: number | null, intervalSeconds: number, nowMs: number): boolean {
  if (lastSeenAtMs === null) return true;
  return nowMs - lastSeenAtMs > SILENT_AFTER_INTERVALS * intervalSeconds * 1000;
}

export interface TelemetryRejectView {
  at: string;
  source: 'broker' | 'ingest';
  reason: RejectReason;
  detail: string;
  payloadExcerpt: string | null;
}

export interface SensorRejectsView {
  sensorId: string;
  deviceId: string;
  countsByReason: Partial<Record<RejectReason, number>>;
  latest: TelemetryRejectView[];
}

/**
 * How a history answer was made: raw readings, rollup buckets (with a min/max envelope),
 * or points picked by LTTB (Steinarsson 2013) from the source named in `source`.
 */
export type HistoryResolution = 'raw' | 'rollup' | 'lttb';
export type HistorySource = 'reading' | 'rollup_5m' | 'rollup_1h';

/** [epoch ms, value °C]. */
export type HistoryPoint = [number, number];
/** [epoch ms (bucket start), min °C, max °C]. */
export type HistoryEnvelopePoint = [number, number, number];

export interface ProbeHistory {
  /** Raw values, bucket means, or LTTB-selected raw points. */
  points: HistoryPoint[];
  /** Each bucket's min and max (rollup resolutions only). */
  envelope: HistoryEnvelopePoint[] | null;
}

export interface ApplianceHistory {
  applianceId: string;
  from: string;
  to: string;
  resolution: HistoryResolution;
  source: HistorySource;
  /** Width of one point for rollups (5 min, 1 h or several hours merged), in ms; null otherwise. */
  bucketMs: number | null;
  probes: Partial<Record<Probe, ProbeHistory>>;
  sensor: { lastSeenAt: string | null; intervalSeconds: number; silent: boolean } | null;
}
