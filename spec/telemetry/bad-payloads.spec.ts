import type { MqttClient } from 'mqtt';
import type { RunningBroker } from '../../broker/create-broker';
import type { IngestWorker } from '../../server/ingest/worker';
import { readingTopic } from '../../shared/telemetry';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { connectDevice, countRows, createDevice, createPlacement, eventually, ingestConfig, publishAll, testBroker, testWorker, type TestDevice } from './support/telemetry-fixture';

describe('ingest: bad payloads through the real broker', () => {
  let db: TestDatabase;
  let broker: RunningBroker;
  let worker: IngestWorker;
  let device: TestDevice;
  let client: MqttClient;

  const at = (minutesAgo: number) => new Date(Date.now() - minutesAgo * 60_000).toISOString();
  const reading = (seq: number, extra: Record<string, unknown> = {}) => JSON.stringify({ sensor: device.deviceId, seq, at: at(100 - seq), fresh_food: 3.5, freezer: -18, ...extra });

  beforeAll(async () => {
    db = await createTestDatabase();
    const placement = await createPlacement(db.dataSource);
    device = await createDevice(db.dataSource, placement);
    broker = await testBroker(db.url);
    const url = `mqtt://127.0.0.1:${broker.port}`;
    worker = testWorker(url, db.url, ingestConfig());
    await worker.start();
    client = await connectDevice(url, device);
  }, 30_000);

  afterAll(async () => {
    await client?.endAsync();
    await worker?.stop();
    await broker?.close();
    await db?.drop();
  });

  it('counts each malformed message by reason, keeps samples on the sensor, and keeps ingesting', async () => {
    const bad: [string, string][] = [
      ['not-json', 'not json at all'],
      ['not-json', '{"sensor": "cw-x", "fresh_food": NaN}'],
      ['schema', reading(1, { fresh_food: 'warm' })],
      ['schema', reading(2, { seq: -1 })],
      ['schema', JSON.stringify({ seq: 3, at: at(1), fresh_food: 3 })],
      ['schema', reading(4, { fresh_food: undefined, freezer: undefined })],
      ['too-large', reading(5, { note: 'x'.repeat(20_000) })],
      ['out-of-range', reading(6, { fresh_food: 71.5 })],
      ['topic-mismatch', reading(7, { sensor: 'cw-someone-else' })],
      ['future-timestamp', reading(8, { at: new Date(Date.now() + 3_600_000).toISOString() })],
    ];
    const topic = readingTopic(device.deviceId);
    await publishAll(client, bad.map(([, payload]) => ({ topic, payload })));
    // Sentinel values are stored as flags and counted; a good reading follows everything.
    await publishAll(client, [
      { topic, payload: reading(20, { fresh_food: -127 }) },
      { topic, payload: reading(21, { freezer: 85 }) },
      { topic, payload: reading(22) },
    ]);

    await eventually('the good readings', async () => (await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading WHERE sensor_id = $1', [device.sensorId])) === 3);
    await worker.idle();
    const counts: { reason: string; count: string }[] = await db.dataSource.query('SELECT reason, count FROM telemetry_reject_count WHERE sensor_id = $1', [device.sensorId]);
    const byReason = Object.fromEntries(counts.map((row) => [row.reason, Number(row.count)]));
    const expected: Record<string, number> = { 'sensor-error-value': 2 };
    for (const [reason] of bad) expected[reason] = (expected[reason] ?? 0) + 1;
    expect(byReason).toEqual(expected);

    const flagged = await db.dataSource.query('SELECT seq, fresh_food_c, fresh_food_flag, freezer_c, freezer_flag FROM reading WHERE sensor_id = $1 ORDER BY seq', [device.sensorId]);
    expect(flagged).toEqual([
      { seq: '20', fresh_food_c: null, fresh_food_flag: 'disconnected', freezer_c: -18, freezer_flag: null },
      { seq: '21', fresh_food_c: 3.5, fresh_food_flag: null, freezer_c: null, freezer_flag: 'power-on' },
      { seq: '22', fresh_food_c: 3.5, fresh_food_flag: null, freezer_c: -18, freezer_flag: null },
    ]);
    // The flagged values never reach the rollups.
    const [rollup] = await db.dataSource.query('SELECT min(fresh_food_min) AS ff_min, max(freezer_max) AS fz_max FROM reading_rollup_1h WHERE appliance_id = $1', [device.applianceId]);
    expect(rollup).toEqual({ ff_min: 3.5, fz_max: -18 });

    const samples: { reason: string; payload_excerpt: string }[] = await db.dataSource.query('SELECT reason, payload_excerpt FROM telemetry_reject WHERE sensor_id = $1', [device.sensorId]);
    // Every reason has samples for the sensor page (a flood keeps only a few per reason and batch).
    for (const reason of Object.keys(expected)) {
      const kept = samples.filter((sample) => sample.reason === reason).length;
      expect(kept).withContext(reason).toBeGreaterThanOrEqual(1);
      expect(kept).withContext(reason).toBeLessThanOrEqual(expected[reason]);
    }
    const large = samples.find((sample) => sample.reason === 'too-large');
    expect(large?.payload_excerpt.length).toBeLessThan(200);
    expect(worker.stats().connected).toBeTrue();
  }, 30_000);

  it('counts a reading from a sensor archived after it signed in as unknown, without storing it', async () => {
    const archived = await createDevice(db.dataSource, await createPlacement(db.dataSource));
    const url = `mqtt://127.0.0.1:${broker.port}`;
    const archivedClient = await connectDevice(url, archived);
    await db.dataSource.query('UPDATE sensor SET archived_at = now() WHERE id = $1', [archived.sensorId]);
    await archivedClient.publishAsync(readingTopic(archived.deviceId), JSON.stringify({ sensor: archived.deviceId, seq: 1, at: at(1), fresh_food: 4 }), { qos: 1 });
    await archivedClient.endAsync();
    await eventually('the unknown-sensor reject', async () => (await countRows(db.dataSource, `SELECT coalesce(sum(count), 0) AS n FROM telemetry_reject_count WHERE reason = 'unknown-sensor'`)) === 1);
    expect(await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading WHERE sensor_id = $1', [archived.sensorId])).toBe(0);
  }, 30_000);

  it('stores the rest of a batch the database partly refuses, and counts the refused reading', async () => {
    const victim = await createDevice(db.dataSource, await createPlacement(db.dataSource));
    const victimClient = await connectDevice(`mqtt://127.0.0.1:${broker.port}`, victim);
    // A data error no validation foresaw, forced with a constraint: it must not block the ingest.
    await db.dataSource.query('ALTER TABLE reading ADD CONSTRAINT spec_refuses_seq_913 CHECK (seq <> 913)');
    try {
      const topic = readingTopic(victim.deviceId);
      const batch = [910, 911, 912, 913, 914, 915].map((seq) => ({ topic, payload: JSON.stringify({ sensor: victim.deviceId, seq, at: at(1000 - seq), fresh_food: seq === 911 ? 1e-50 : 4 }) }));
      await publishAll(victimClient, batch);
      await eventually('the other readings', async () => (await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading WHERE sensor_id = $1', [victim.sensorId])) === 5);
      await eventually('the refused reading to be counted', async () => (await countRows(db.dataSource, `SELECT coalesce(sum(count), 0) AS n FROM telemetry_reject_count WHERE reason = 'store-error' AND sensor_id = $1`, [victim.sensorId])) === 1);
      const stored: { seq: string; fresh_food_c: number }[] = await db.dataSource.query('SELECT seq, fresh_food_c FROM reading WHERE sensor_id = $1 ORDER BY seq', [victim.sensorId]);
      expect(stored.map((row) => Number(row.seq))).toEqual([910, 911, 912, 914, 915]);
      // A value too small for PostgreSQL's real is rounded to 0.0001 °C steps, not refused.
      expect(stored[1].fresh_food_c).toBe(0);
    } finally {
      await db.dataSource.query('ALTER TABLE reading DROP CONSTRAINT spec_refuses_seq_913');
      await victimClient.endAsync();
    }
  }, 30_000);
});
