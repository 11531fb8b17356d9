import type { MqttClient } from 'mqtt';
import { startLocalCluster, type LocalCluster } from '../../broker/cluster/local-cluster';
import { ensureRedisServer } from '../../broker/cluster/redis-server';
import { readingTopic, SHARD_COUNT, shardOf } from '../../shared/telemetry';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { TEST_INGEST, connectDevice, countRows, createDevice, createPlacement, eventually, publishAll, sleep, type TestDevice } from '../telemetry/support/telemetry-fixture';

const READINGS_PER_DEVICE = 240;
const DEVICES_PER_COMBINATION = 2;

/** Which half of the shards a device is in (worker 0 or 1). */
const ownerOf = (device: TestDevice) => (shardOf(device.deviceId) < SHARD_COUNT / 2 ? 0 : 1);

function payloads(device: TestDevice, fromSeq: number, toSeq: number, startMs: number) {
  const messages = [];
  for (let seq = fromSeq; seq < toSeq; seq++) {
    const payload = { sensor: device.deviceId, seq, at: new Date(startMs + seq * 60_000).toISOString(), fresh_food: 3 + (seq % 16) / 16, freezer: -18 };
    messages.push({ topic: readingTopic(device.deviceId), payload: JSON.stringify(payload) });
  }
  return messages;
}

describe('clustered broker: two aedes processes over Redis, two ingest workers', () => {
  let db: TestDatabase;
  let cluster: LocalCluster;
  let devices: TestDevice[];
  let clients: MqttClient[];

  beforeAll(async () => {
    ensureRedisServer((message) => console.log(`[cluster spec] ${message}`));
    db = await createTestDatabase();
    const placement = await createPlacement(db.dataSource);
    // Sensors of both shard halves on both brokers, so readings must cross brokers.
    devices = [];
    const perCombination = new Map<string, number>();
    while (devices.length < 4 * DEVICES_PER_COMBINATION) {
      const device = await createDevice(db.dataSource, placement);
      const key = `${ownerOf(device)}-${devices.length % 2}`;
      if ((perCombination.get(key) ?? 0) >= DEVICES_PER_COMBINATION) continue;
      perCombination.set(key, (perCombination.get(key) ?? 0) + 1);
      devices.push(device);
    }
    cluster = await startLocalCluster({ databaseUrl: db.url, ingestPassword: TEST_INGEST.password, logLevel: process.env.CLUSTER_LOG ?? 'warn', echo: !!process.env.CLUSTER_LOG });
    clients = await Promise.all(devices.map((device, i) => connectDevice(cluster.brokerUrls[i % 2], device)));
  }, 120_000);

  afterAll(async () => {
    await Promise.all((clients ?? []).map((client) => client.endAsync()));
    await cluster?.stop();
    await db?.drop();
  }, 30_000);

  it('stores every reading once, across a crashed worker that comes back through the other broker', async () => {
    const startMs = Date.now() - READINGS_PER_DEVICE * 60_000;
    const total = devices.length * READINGS_PER_DEVICE;
    const third = READINGS_PER_DEVICE / 3;

    await Promise.all(clients.map((client, i) => publishAll(client, payloads(devices[i], 0, third, startMs))));
    await eventually('the first third', async () => (await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading')) === devices.length * third, 30_000);

    // Worker 1 crashes; its shards' readings queue in its session in Redis meanwhile.
    await cluster.killWorker(0);
    await Promise.all(clients.map((client, i) => publishAll(client, payloads(devices[i], third, 2 * third, startMs))));
    await sleep(300);
    await cluster.startWorker(0, 1);
    await Promise.all(clients.map((client, i) => publishAll(client, payloads(devices[i], 2 * third, READINGS_PER_DEVICE, startMs))));

    await eventually('every reading', async () => (await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading')) >= total, 60_000);
    await sleep(1000);
    expect(await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading')).toBe(total);
    for (const device of devices) {
      const [row] = await db.dataSource.query('SELECT count(DISTINCT seq)::int AS seqs, min(seq)::int AS first, max(seq)::int AS last FROM reading WHERE sensor_id = $1', [device.sensorId]);
      expect(row).withContext(`${device.deviceId} (shard ${shardOf(device.deviceId)})`).toEqual({ seqs: READINGS_PER_DEVICE, first: 0, last: READINGS_PER_DEVICE - 1 });
    }
    expect(await countRows(db.dataSource, 'SELECT sum(reading_count) AS n FROM reading_rollup_1h')).toBe(total);
  }, 120_000);
});
