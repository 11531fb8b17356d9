import type { RejectReason } from '../../shared/api/telemetry';
import {
  MAX_READING_PAYLOAD_BYTES,
  PROBE_ERROR_VALUES,
  PROBE_VALID_MAX_C,
  PROBE_VALID_MIN_C,
  parseReadingTopic,
  readingPayloadSchema,
  type ProbeErrorFlag,
  type ReadingPayload,
} from '../../shared/telemetry';

/** A reading that passed every check that needs no database. */
export interface ValidReading {
  deviceId: string;
  seq: number;
  atMs: number;
  freshFoodC: number | null;
  freezerC: number | null;
  freshFoodFlag: ProbeErrorFlag | null;
  freezerFlag: ProbeErrorFlag | null;
  batteryV: number | null;
  doorOpen: boolean | null;
}

export interface RejectNote {
  reason: RejectReason;
  detail: string;
}

export type Verdict =
  | { ok: true; reading: ValidReading; notes: RejectNote[] }
  | { ok: false; reason: RejectReason; detail: string; deviceId: string | null };

export interface ValidationLimits {
  nowMs: number;
  /** Readings older than this are rejected: they would fall outside the raw retention. */
  oldestAcceptedMs: number;
  /** Tolerated clock skew of a sensor ahead of the server. */
  maxFutureSkewMs: number;
}

const reject = (reason: RejectReason, detail: string, deviceId: string | null): Verdict => ({ ok: false, reason, detail, deviceId });

function parseJson(payload: Buffer): unknown {
  try {
    return JSON.parse(payload.toString('utf8'));
  } catch {
    return undefined;
  }
}

function errorFlagOf(valueC: number): ProbeErrorFlag | null {
  for (const [flag, errorValueC] of Object.entries(PROBE_ERROR_VALUES)) {
    if (valueC === errorValueC) return flag as ProbeErrorFlag;
  }
  return null;
}

type ProbeCheck = { valueC: number | null; flag: ProbeErrorFlag | null } | { outOfRange: number };

/** 0.0001 °C is far below any probe's resolution; it also keeps values PostgreSQL's real can hold (1e-50 cannot). */
const roundC = (valueC: number) => Math.round(valueC * 10_000) / 10_000;

function checkProbe(valueC: number | null | undefined): ProbeCheck {
  if (valueC === null || valueC === undefined) return { valueC: null, flag: null };
  const flag = errorFlagOf(valueC);
  if (flag) return { valueC: null, flag };
  if (valueC < PROBE_VALID_MIN_C || valueC > PROBE_VALID_MAX_C) return { outOfRange: valueC };
  return { valueC: roundC(valueC), flag: null };
}

function schemaDetail(issues: { path: PropertyKey[]; message: string }[]): string {
  return issues
    .slice(0, 3)
    .map((issue) => `${issue.path.map(String).join('.') || '(payload)'}: ${issue.message}`)
    .join('; ');
}

function checkTime(atMs: number, limits: ValidationLimits, deviceId: string): Verdict | null {
  if (atMs > limits.nowMs + limits.maxFutureSkewMs) return reject('future-timestamp', `reading time ${new Date(atMs).toISOString()}`, deviceId);
  if (atMs < limits.oldestAcceptedMs) return reject('too-old', `reading time ${new Date(atMs).toISOString()}`, deviceId);
  return null;
}

function toReading(payload: ReadingPayload, atMs: number, fresh: { valueC: number | null; flag: ProbeErrorFlag | null }, freezer: { valueC: number | null; flag: ProbeErrorFlag | null }): ValidReading {
  return {
    deviceId: payload.sensor,
    seq: payload.seq,
    atMs,
    freshFoodC: fresh.valueC,
    freezerC: freezer.valueC,
    freshFoodFlag: fresh.flag,
    freezerFlag: freezer.flag,
    batteryV: payload.battery_v === undefined ? null : roundC(payload.battery_v),
    doorOpen: payload.door === undefined ? null : payload.door === 'open',
  };
}

/**
 * Every check of one message that needs no database, cheapest first. Never throws: any
 * input, however broken, ends as a verdict.
 */
export function validateMessage(topic: string, payload: Buffer, limits: ValidationLimits): Verdict {
  const route = parseReadingTopic(topic);
  if (!route) return reject('bad-topic', topic.slice(0, 200), null);
  const { deviceId } = route;
  if (payload.length > MAX_READING_PAYLOAD_BYTES) return reject('too-large', `${payload.length} bytes`, deviceId);
  const json = parseJson(payload);
  if (json === undefined) return reject('not-json', `${payload.length} bytes that do not parse as JSON`, deviceId);
  const parsed = readingPayloadSchema.safeParse(json);
  if (!parsed.success) return reject('schema', schemaDetail(parsed.error.issues), deviceId);
  if (parsed.data.sensor !== deviceId) return reject('topic-mismatch', `payload names ${parsed.data.sensor}`, deviceId);

  const atMs = Date.parse(parsed.data.at);
  const timeVerdict = checkTime(atMs, limits, deviceId);
  if (timeVerdict) return timeVerdict;
  const fresh = checkProbe(parsed.data.fresh_food);
  const freezer = checkProbe(parsed.data.freezer);
  if ('outOfRange' in fresh) return reject('out-of-range', `fresh_food ${fresh.outOfRange} °C`, deviceId);
  if ('outOfRange' in freezer) return reject('out-of-range', `freezer ${freezer.outOfRange} °C`, deviceId);

  const notes: RejectNote[] = [];
  if (fresh.flag) notes.push({ reason: 'sensor-error-value', detail: `fresh_food ${PROBE_ERROR_VALUES[fresh.flag]} °C (${fresh.flag})` });
  if (freezer.flag) notes.push({ reason: 'sensor-error-value', detail: `freezer ${PROBE_ERROR_VALUES[freezer.flag]} °C (${freezer.flag})` });
  return { ok: true, reading: toReading(parsed.data, atMs, fresh, freezer), notes };
}
