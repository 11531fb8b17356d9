import type { MqttClient } from 'mqtt';
import type { RunningBroker } from '../../broker/create-broker';
import type { CommittedBatch } from '../../server/ingest/pipeline';
import type { IngestWorker } from '../../server/ingest/worker';
import { readingTopic } from '../../shared/telemetry';
import { readingPayload } from '../../simulator/cli/device-link';
import { createRng, generateTrace, randomProfile } from '../../simulator/model';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { describeIngest } from '../../server/services/ingest-probe';
import {
  TcpProxy,
  connectDevice,
  countRows,
  createDevice,
  createPlacement,
  eventually,
  ingestConfig,
  publishAll,
  sleep,
  testBroker,
  testWorker,
  type TestDevice,
} from './support/telemetry-fixture';

interface Sent {
  topic: string;
  payload: string;
  seq: number;
}

/** A device's readings from the simulator's model, as the payloads it would publish. */
function modelReadings(device: TestDevice, seed: number, count: number, endMs: number): Sent[] {
  const intervalMs = 60_000;
  const trace = generateTrace({ profile: randomProfile(createRng(seed), 'top-freezer'), seed, startMs: endMs - count * intervalMs, durationMs: count * intervalMs, intervalMs });
  return trace.map((sample, seq) => ({ topic: readingTopic(device.deviceId), payload: JSON.stringify(readingPayload(device.deviceId, seq, sample)), seq }));
}

describe('ingest end to end: broker → ingest → PostgreSQL', () => {
  let db: TestDatabase;
  let broker: RunningBroker;
  let url: string;
  let devices: TestDevice[];
  let clients: MqttClient[];
  const workers: IngestWorker[] = [];

  const start = (worker: IngestWorker) => {
    workers.push(worker);
    return worker.start();
  };

  beforeAll(async () => {
    db = await createTestDatabase();
    const placement = await createPlacement(db.dataSource);
    devices = [await createDevice(db.dataSource, placement), await createDevice(db.dataSource, placement), await createDevice(db.dataSource, placement)];
    broker = await testBroker(db.url);
    url = `mqtt://127.0.0.1:${broker.port}`;
    clients = await Promise.all(devices.map((device) => connectDevice(url, device)));
  }, 30_000);

  afterEach(async () => {
    await Promise.all(workers.splice(0).map((worker) => worker.stop()));
    await db.dataSource.query('TRUNCATE reading, reading_rollup_5m, reading_rollup_1h, telemetry_reject, telemetry_reject_count');
  });

  afterAll(async () => {
    await Promise.all((clients ?? []).map((client) => client.endAsync()));
    await broker?.close();
    await db?.drop();
  });

  const storedCount = () => countRows(db.dataSource, 'SELECT count(*) AS n FROM reading');

  it('stores every reading exactly once across an ingest restart, duplicates and out-of-order delivery', async () => {
    const endMs = Date.now() - 60_000;
    const perDevice = devices.map((device, index) => modelReadings(device, 100 + index, 300, endMs));
    const total = perDevice.reduce((sum, readings) => sum + readings.length, 0);
    const fedToDetection: CommittedBatch[] = [];
    const clientId = 'cw-ingest-e2e-restart';
    const first = testWorker(url, db.url, ingestConfig({ clientId }), (batch) => void fedToDetection.push(batch));
    await start(first);

    // First half in order; then the ingest goes away while the second half is published.
    await Promise.all(clients.map((client, i) => publishAll(client, perDevice[i].slice(0, 150))));
    await sleep(30);
    await first.stop();
    await Promise.all(clients.map((client, i) => publishAll(client, perDevice[i].slice(150, 250))));
    const second = testWorker(url, db.url, ingestConfig({ clientId }), (batch) => void fedToDetection.push(batch));
    await start(second);

    // The rest arrives newest first, and 40 earlier readings per device arrive a second time.
    await Promise.all(clients.map((client, i) => publishAll(client, perDevice[i].slice(250).reverse())));
    await Promise.all(clients.map((client, i) => publishAll(client, perDevice[i].filter((_, k) => k % 7 === 3).slice(0, 40))));

    await eventually('every reading to be stored', async () => (await storedCount()) >= total, 30_000);
    await sleep(300);
    await second.idle();
    expect(await storedCount()).toBe(total);

    for (const [i, device] of devices.entries()) {
      const rows: { seq: string }[] = await db.dataSource.query('SELECT seq FROM reading WHERE sensor_id = $1 ORDER BY at', [device.sensorId]);
      // Sorted by reading time, the sequence numbers come out in order: out-of-order arrival is undone.
      expect(rows.map((row) => Number(row.seq))).withContext(device.deviceId).toEqual(perDevice[i].map((sent) => sent.seq));
    }
    // The sensor row: its newest reading's own time, and when the ingest last heard it (now, not a minute ago).
    const [sensor] = await db.dataSource.query('SELECT last_seen_at, last_heard_at FROM sensor WHERE id = $1', [devices[0].sensorId]);
    expect(new Date(sensor.last_seen_at).getTime()).toBe(Math.max(...perDevice[0].map((sent) => Date.parse(JSON.parse(sent.payload).at))));
    expect(Date.now() - new Date(sensor.last_heard_at).getTime()).toBeLessThan(30_000);
    expect(new Date(sensor.last_heard_at).getTime()).toBeGreaterThan(new Date(sensor.last_seen_at).getTime());

    // Rollups count each reading once, though some arrived twice.
    expect(await countRows(db.dataSource, 'SELECT sum(reading_count) AS n FROM reading_rollup_1h')).toBe(total);
    expect(await countRows(db.dataSource, 'SELECT sum(reading_count) AS n FROM reading_rollup_5m')).toBe(total);

    // The detection hook saw each new reading once, in time order per appliance within a batch.
    const fed = fedToDetection.flatMap((batch) => batch.readings);
    expect(fed.length).toBe(total);
    expect(new Set(fed.map((reading) => `${reading.sensorId}|${reading.atMs}`)).size).toBe(total);
    for (const batch of fedToDetection) {
      for (let k = 1; k < batch.readings.length; k++) {
        const [a, b] = [batch.readings[k - 1], batch.readings[k]];
        if (a.applianceId === b.applianceId) expect(b.atMs).toBeGreaterThan(a.atMs);
      }
    }
  }, 90_000);

  it('rides out a database outage with back-off, and acknowledges nothing it has not stored', async () => {
    const proxy = new TcpProxy('127.0.0.1', Number(new URL(db.url).port));
    await proxy.start();
    const clientId = 'cw-ingest-e2e-outage';
    const readings = modelReadings(devices[0], 7, 200, Date.now() - 60_000);
    try {
      const worker = testWorker(url, proxy.urlFor(db.url), ingestConfig({ clientId }));
      await start(worker);
      await publishAll(clients[0], readings.slice(0, 50));
      await eventually('the first 50 readings', async () => (await storedCount()) === 50);

      // Outage that heals: the worker retries and stores what waited.
      proxy.down();
      await publishAll(clients[0], readings.slice(50, 80));
      await sleep(500);
      expect(worker.stats().retries).toBeGreaterThan(0);
      // The status page says so while it lasts, and clears once a batch is stored again.
      expect(describeIngest(worker.stats(), Date.now())).toEqual(jasmine.objectContaining({ state: 'down', detail: jasmine.stringMatching(/^storing readings has failed since .* UTC/) }));
      proxy.up();
      await eventually('the readings held during the outage', async () => (await storedCount()) === 80);
      expect(worker.stats().failingSinceMs).toBeNull();
      expect(describeIngest(worker.stats(), Date.now()).state).toBe('up');

      // Outage during which the worker dies: nothing it held was acknowledged, so the broker
      // hands all of it to the next worker with the same session.
      proxy.down();
      await publishAll(clients[0], readings.slice(80));
      await sleep(300);
      await worker.stop();
      proxy.up();
      const successor = testWorker(url, db.url, ingestConfig({ clientId }));
      await start(successor);
      await eventually('the readings the dead worker held', async () => (await storedCount()) === readings.length, 20_000);
      await sleep(200);
      expect(await storedCount()).toBe(readings.length);
    } finally {
      await proxy.close();
    }
  }, 60_000);

  it('stops reading from the broker while its unacknowledged window is full', async () => {
    const proxy = new TcpProxy('127.0.0.1', Number(new URL(db.url).port));
    await proxy.start();
    try {
      const worker = testWorker(url, proxy.urlFor(db.url), ingestConfig({ clientId: 'cw-ingest-e2e-window', maxUnacked: 25 }));
      await start(worker);
      proxy.down();
      await publishAll(clients[1], modelReadings(devices[1], 9, 120, Date.now() - 60_000));
      await sleep(400);
      // Memory stays bounded: the rest waits in the broker's session, not in the worker.
      expect(worker.stats().received).toBe(25);
      proxy.up();
      await eventually('all readings after the outage', async () => (await storedCount()) === 120, 20_000);
    } finally {
      await proxy.close();
    }
  }, 60_000);
});
