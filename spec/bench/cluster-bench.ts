/**
 * Clustered ingest benchmark, run by `npm run bench` or on its own:
 *   TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx spec/bench/cluster-bench.ts
 * The configuration `npm test`'s cluster spec checks for correctness, under load: Redis, two
 * aedes processes sharing state through it, two ingest workers owning half the shards each,
 * and 50 sensors signed in alternately to either broker (as behind a TCP load balancer), so
 * about half the readings cross brokers through Redis. On one 2-core machine every process
 * competes for the same cores, so this measures what the cluster costs, not what it scales
 * to; the single-process figure is spec/bench/ingest-bench.ts. Installs Debian's
 * redis-server when missing. BENCH_READINGS changes the run length (default 50,000).
 */
import os from 'node:os';
import { startLocalCluster, type LocalCluster } from '../../broker/cluster/local-cluster';
import { ensureRedisServer } from '../../broker/cluster/redis-server';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { TEST_INGEST, createDevice, createPlacement, sleep, type TestDevice } from '../telemetry/support/telemetry-fixture';
import { startPublisher, type Publisher } from './support/publisher';

const READINGS = Number(process.env.BENCH_READINGS ?? 50_000);
const DEVICES = 50;
const WINDOW_PER_DEVICE = 8;
const DAY_MS = 86_400_000;
const TIMEOUT_MS = 180_000;

async function storedRows(db: TestDatabase): Promise<{ rows: number; distinct: number }> {
  const [row] = await db.dataSource.query('SELECT count(*)::int AS rows, count(DISTINCT (sensor_id, seq))::int AS distinct FROM reading');
  return { rows: row.rows, distinct: row.distinct };
}

async function waitForRows(db: TestDatabase, count: number): Promise<number> {
  const deadline = Date.now() + TIMEOUT_MS;
  for (;;) {
    const [row] = await db.dataSource.query('SELECT count(*)::int AS n FROM reading');
    if (row.n >= count) return Date.now();
    if (Date.now() > deadline) throw new Error(`only ${row.n} of ${count} readings stored after ${TIMEOUT_MS / 1000} s`);
    await sleep(100);
  }
}

async function main(): Promise<void> {
  ensureRedisServer((message) => console.log(`[cluster bench] ${message}`));
  const loadAtStart = os.loadavg().map((value) => value.toFixed(1)).join(' / ');
  const db = await createTestDatabase('cw_cluster_bench');
  let cluster: LocalCluster | null = null;
  let publisher: Publisher | null = null;
  try {
    const placement = await createPlacement(db.dataSource);
    const devices: TestDevice[] = [];
    for (let i = 0; i < DEVICES; i++) devices.push(await createDevice(db.dataSource, placement));
    cluster = await startLocalCluster({ databaseUrl: db.url, ingestPassword: TEST_INGEST.password });
    const urls = cluster.brokerUrls;
    publisher = await startPublisher(devices.map((device, i) => ({ ...device, url: urls[i % urls.length] })), { window: WINDOW_PER_DEVICE });

    const startedMs = Date.now();
    await publisher.run({ count: READINGS, baseMs: Date.now() - 30 * DAY_MS, firstSeq: 0 });
    const storedMs = await waitForRows(db, READINGS);
    await sleep(1000);
    const stored = await storedRows(db);
    const perS = Math.round(READINGS / ((storedMs - startedMs) / 1000));
    const load = os.loadavg().map((value) => value.toFixed(1)).join(' / ');
    console.log(
      [
        `Clustered ingest: Redis + ${urls.length} aedes processes + ${cluster.workers.length} ingest workers (shards ${cluster.workers.map((worker) => worker.shards).join(', ')}), ${DEVICES} sensors alternately on each broker, ${WINDOW_PER_DEVICE} in flight per sensor`,
        `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, Node ${process.version}, ${new Date().toISOString()}, load average at start ${loadAtStart}, at end ${load}`,
        `  MQTT publish → committed rows, QoS 1: ${perS.toLocaleString('en-US')} readings/s`,
        `  rows stored / readings published: ${stored.rows.toLocaleString('en-US')} / ${READINGS.toLocaleString('en-US')} (${stored.distinct.toLocaleString('en-US')} distinct sensor + sequence)`,
      ].join('\n'),
    );
    if (stored.rows !== READINGS || stored.distinct !== READINGS) process.exitCode = 1;
  } finally {
    publisher?.stop();
    await cluster?.stop();
    await db.drop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
