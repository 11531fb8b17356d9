import express from 'express';
import request from 'supertest';
import { errorHandler } from '../../server/middleware/error-handler';
import { notFound } from '../../server/errors';
import { PartitionManager } from '../../server/ingest/partitions';
import { insertReadings, type StoredReading } from '../../server/ingest/store';
import { telemetryRouter } from '../../server/routes/history';
import { HistoryService, type TelemetryAccess } from '../../server/telemetry/history-service';
import { lttb } from '../../server/telemetry/lttb';
import { RejectsService } from '../../server/telemetry/rejects-service';
import type { ApplianceHistory, HistoryPoint } from '../../shared/api/telemetry';
import { Pool } from 'pg';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { createDevice, createPlacement, type TestDevice } from './support/telemetry-fixture';

const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;
const DAY_MS = 24 * HOUR_MS;
const ORIGIN_MS = Date.UTC(2000, 0, 1);

/** 12-bit probe steps (1/16 °C) are exact in PostgreSQL's real, so min and max compare exactly. */
const sixteenth = (value: number) => Math.round(value * 16) / 16;

/** A year of one-minute readings: compressor cycles, a daily swing, and a door spike now and then. */
function yearOfReadings(device: TestDevice, startMs: number): StoredReading[] {
  const readings: StoredReading[] = [];
  for (let i = 0; i < 365 * 24 * 60; i++) {
    const atMs = startMs + i * MINUTE_MS;
    const cycle = Math.sin((2 * Math.PI * i) / 43);
    const day = Math.sin((2 * Math.PI * i) / 1440);
    const door = i % 997 === 0 ? 4 : 0;
    readings.push({
      deviceId: device.deviceId,
      sensorId: device.sensorId,
      applianceId: device.applianceId,
      seq: i,
      atMs,
      freshFoodC: sixteenth(3 + 0.8 * cycle + 0.3 * day + door),
      freezerC: sixteenth(-18.5 + 1.2 * cycle + 0.2 * day + door / 2),
      freshFoodFlag: null,
      freezerFlag: null,
      batteryV: 3.1,
      doorOpen: door > 0,
    });
  }
  return readings;
}

function expectedEnvelope(readings: StoredReading[], widthMs: number, pick: (r: StoredReading) => number | null): Map<number, [number, number]> {
  const buckets = new Map<number, [number, number]>();
  for (const reading of readings) {
    const value = pick(reading);
    if (value === null) continue;
    const bucket = ORIGIN_MS + Math.floor((reading.atMs - ORIGIN_MS) / widthMs) * widthMs;
    const seen = buckets.get(bucket);
    buckets.set(bucket, seen ? [Math.min(seen[0], value), Math.max(seen[1], value)] : [value, value]);
  }
  return buckets;
}

type SpecActor = { name: string };

describe('history API', () => {
  let db: TestDatabase;
  let device: TestDevice;
  let readings: StoredReading[];
  let startMs: number;
  let endMs: number;
  let denied: Set<string>;
  const access: TelemetryAccess<SpecActor> = {
    async assertCanReadAppliance(actor, applianceId) {
      if (denied.has(actor.name)) throw notFound('appliance');
      if (!applianceId) throw notFound('appliance');
    },
  };

  const app = () => {
    const server = express();
    server.use((req, _res, next) => {
      (req as unknown as { actor: SpecActor }).actor = { name: String(req.headers['x-spec-actor'] ?? 'manager') };
      next();
    });
    server.use(
      '/api',
      telemetryRouter<SpecActor>({
        history: new HistoryService(db.dataSource, access),
        rejects: new RejectsService(db.dataSource, access),
        mayReadHistory: (_req, _res, next) => next(),
        mayReadRejects: (_req, _res, next) => next(),
        actorOf: (req) => (req as unknown as { actor: SpecActor }).actor,
      }),
    );
    server.use(errorHandler(false));
    return server;
  };

  const history = async (fromMs: number, toMs: number, extra = ''): Promise<ApplianceHistory> => {
    const res = await request(app())
      .get(`/api/appliances/${device.applianceId}/history?from=${new Date(fromMs).toISOString()}&to=${new Date(toMs).toISOString()}${extra}`)
      .expect(200);
    return res.body;
  };

  beforeAll(async () => {
    denied = new Set();
    db = await createTestDatabase();
    device = await createDevice(db.dataSource, await createPlacement(db.dataSource));
    startMs = Date.UTC(new Date().getUTCFullYear() - 1, 0, 1);
    readings = yearOfReadings(device, startMs);
    endMs = readings[readings.length - 1].atMs + MINUTE_MS;
    // Through the ingest's own store path, so the rollups are the ones live ingest maintains.
    const pool = new Pool({ connectionString: db.url, max: 1 });
    const partitions = new PartitionManager(pool);
    const client = await pool.connect();
    try {
      await partitions.ensureFor(client, [startMs, endMs]);
      await partitions.ensureFor(client, readings.filter((_, i) => i % 20_000 === 0).map((r) => r.atMs));
      for (let i = 0; i < readings.length; i += 20_000) {
        await client.query('BEGIN');
        await insertReadings(client, readings.slice(i, i + 20_000));
        await client.query('COMMIT');
      }
    } finally {
      client.release();
      await pool.end();
    }
  }, 120_000);

  afterAll(async () => db?.drop());

  it('answers a year of one-minute readings with at most 2,000 points per probe, keeping every bucket’s min and max', async () => {
    const body = await history(startMs, endMs);
    expect(body.resolution).toBe('rollup');
    expect(body.source).toBe('rollup_1h');
    expect(body.bucketMs).toBe(6 * HOUR_MS);
    for (const [probe, pick] of [
      ['fresh_food', (r: StoredReading) => r.freshFoodC],
      ['freezer', (r: StoredReading) => r.freezerC],
    ] as const) {
      const series = body.probes[probe]!;
      expect(series.points.length).toBeLessThanOrEqual(2000);
      const expected = expectedEnvelope(readings, 6 * HOUR_MS, pick);
      expect(series.envelope!.length).toBe(expected.size);
      for (const [t, min, max] of series.envelope!) {
        expect([min, max]).withContext(`${probe} ${new Date(t).toISOString()}`).toEqual(expected.get(t)!);
      }
    }
    // The door spikes (+4 °C for a minute) survive in the envelope though the means hide them.
    const highest = Math.max(...body.probes.fresh_food!.envelope!.map(([, , max]) => max));
    expect(highest).toBe(readings.reduce((max, r) => Math.max(max, r.freshFoodC!), -Infinity));
  }, 30_000);

  it('keeps the mean of each bucket equal to the mean of its readings', async () => {
    const fromMs = startMs + 40 * DAY_MS;
    const body = await history(fromMs, fromMs + 3 * DAY_MS);
    expect(body.source).toBe('rollup_5m');
    const inFirstBucket = readings.filter((r) => r.atMs >= fromMs && r.atMs < fromMs + 5 * MINUTE_MS);
    const mean = inFirstBucket.reduce((sum, r) => sum + r.freshFoodC!, 0) / inFirstBucket.length;
    expect(body.probes.fresh_food!.points[0]).toEqual([fromMs, jasmine.any(Number)] as unknown as HistoryPoint);
    expect(body.probes.fresh_food!.points[0][1]).toBeCloseTo(mean, 3);
  });

  it('answers raw readings when they fit, and hourly rollups for a few weeks', async () => {
    const dayFrom = startMs + 100 * DAY_MS;
    const day = await history(dayFrom, dayFrom + DAY_MS);
    expect(day.resolution).toBe('raw');
    expect(day.probes.freezer!.points.length).toBe(1440);
    expect(day.probes.freezer!.envelope).toBeNull();
    const weeks = await history(dayFrom, dayFrom + 21 * DAY_MS);
    expect(weeks).toEqual(jasmine.objectContaining({ resolution: 'rollup', source: 'rollup_1h', bucketMs: HOUR_MS }));
    expect(weeks.probes.fresh_food!.points.length).toBe(21 * 24);
  });

  it('downsamples with LTTB on request, keeping the first and last point', async () => {
    const body = await history(startMs, endMs, '&method=lttb&maxPoints=1500');
    expect(body.resolution).toBe('lttb');
    const points = body.probes.fresh_food!.points;
    expect(points.length).toBe(1500);
    expect(points[0][0]).toBe(startMs);
    expect(points[points.length - 1][0]).toBe(ORIGIN_MS + Math.floor((endMs - 1 - ORIGIN_MS) / HOUR_MS) * HOUR_MS);
  });

  // Check vector: the worked example of ClickHouse's largestTriangleThreeBuckets documentation
  // (an implementation of Steinarsson 2013): ten points, n = 4 → (1,10), (3,15), (9,55), (10,70).
  it('LTTB matches the published check vector', () => {
    const points: HistoryPoint[] = [[1, 10], [2, 20], [3, 15], [4, 30], [5, 40], [6, 35], [7, 50], [8, 60], [9, 55], [10, 70]];
    expect(lttb(points, 4)).toEqual([[1, 10], [3, 15], [9, 55], [10, 70]]);
    expect(lttb(points, 20)).toEqual(points);
  });

  it('runs the scope check first: out of scope answers 404 like a missing appliance', async () => {
    denied.add('outsider');
    const res = await request(app()).get(`/api/appliances/${device.applianceId}/history`).set('x-spec-actor', 'outsider').expect(404);
    expect(res.body.error).toBe('appliance not found');
    await request(app()).get(`/api/sensors/${device.sensorId}/rejects`).set('x-spec-actor', 'outsider').expect(404);
  });

  it('refuses a range that ends before it starts, and says how long the query took', async () => {
    await request(app()).get(`/api/appliances/${device.applianceId}/history?from=2026-02-01T00:00:00Z&to=2026-01-01T00:00:00Z`).expect(400);
    await request(app()).get(`/api/appliances/${device.applianceId}/history?maxPoints=3`).expect(400);
    const res = await request(app()).get(`/api/appliances/${device.applianceId}/history`).expect(200);
    expect(res.headers['server-timing']).toMatch(/^history;dur=\d+(\.\d)?$/);
    expect(res.body.sensor).toEqual({ lastSeenAt: new Date(endMs - MINUTE_MS).toISOString(), intervalSeconds: 60, silent: jasmine.any(Boolean) });
  });
});
