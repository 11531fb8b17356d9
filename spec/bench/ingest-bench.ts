/**
 * Ingest benchmark (issue 3), run by `npm run bench` or on its own:
 *   TSX_TSCONFIG_PATH=server/tsconfig.json node --max-semi-space-size=64 --import tsx spec/bench/ingest-bench.ts
 * against the project's PostgreSQL (a throwaway database). Processes as deployed: the
 * broker in its own process, the sensors (one MQTT connection each) in another, the
 * subscriber or ingest worker in this one. Figures:
 *   0. calibration: plain aedes measured as in ../shared/STACK.md, to scale the rest;
 *   1. the broker alone: QoS 1 readings moved to a subscriber that stores nothing;
 *   2. ingest: readings per second from the first publish to the last committed row,
 *      QoS 1, checked for loss against the table;
 *   3. publish-to-stored latency p50/p99 at a paced 5,000 readings/s;
 *   4. history query p95 (server time) for a one-year range of one-minute readings.
 * BENCH_READINGS changes the run length (default 100,000 per throughput phase), BENCH_WINDOW
 * the unacknowledged publishes per sensor (default 8), BENCH_SKIP_HISTORY=1 skips part 4.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import mqtt from 'mqtt';
import { Pool } from 'pg';
import { freePort, nodeArgsFor, startProcess, tcpOpen, waitFor, type ManagedProcess } from '../../broker/cluster/processes';
import { PartitionManager } from '../../server/ingest/partitions';
import { insertReadings, type StoredReading } from '../../server/ingest/store';
import type { IngestWorker } from '../../server/ingest/worker';
import { HistoryService } from '../../server/telemetry/history-service';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { startPublisher, type Publisher } from './support/publisher';
import { TEST_INGEST, createDevice, createPlacement, ingestConfig, sleep, testWorker, type TestDevice } from '../telemetry/support/telemetry-fixture';

const READINGS = Number(process.env.BENCH_READINGS ?? 100_000);
const DEVICES = 50;
const WINDOW_PER_DEVICE = Number(process.env.BENCH_WINDOW ?? 8);
const LATENCY_RATE_PER_S = 5000;
const LATENCY_SECONDS = 15;
const HISTORY_QUERIES = 40;
/** The table is also kept beside the other benchmark output, in the git-ignored data folder. */
const NOTES_FILE = path.join(__dirname, '..', '..', '.data', 'bench', 'ingest-bench.txt');
const DAY_MS = 86_400_000;
/** BENCH_PROFILE_DIR=dir writes CPU profiles of the broker and publisher processes there. */
const PROFILE_ARGS = process.env.BENCH_PROFILE_DIR ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_PROFILE_DIR}`] : [];
const publisherOptions = { window: WINDOW_PER_DEVICE, nodeArgs: PROFILE_ARGS };

/** 0. Calibration: plain aedes, one publisher with 100 in flight, one subscriber. */
async function plainAedes(): Promise<number> {
  const port = await freePort();
  const broker = startProcess('plain-aedes', process.execPath, ['--import', 'tsx', path.join(__dirname, 'ingest-plain-broker.ts'), String(port)], {
    TSX_TSCONFIG_PATH: path.join(__dirname, '..', '..', 'server', 'tsconfig.json'),
  });
  try {
    await waitFor('starting', broker, () => tcpOpen(port));
    const url = `mqtt://127.0.0.1:${port}`;
    const subscriber = await mqtt.connectAsync(url, { clientId: 'calibration-sub', protocolVersion: 4, clean: true });
    await subscriber.subscribeAsync('calibration/+', { qos: 1 });
    let received = 0;
    subscriber.on('message', () => received++);
    const publisher = await mqtt.connectAsync(url, { clientId: 'calibration-pub', protocolVersion: 4 });
    const count = Math.min(READINGS, 50_000);
    const payload = '{"sensor":"cw-000000000000","seq":1,"at":"2026-01-01T00:00:00.000Z","fresh_food":3.0625,"freezer":-18.5}';
    const pending = new Set<Promise<unknown>>();
    const startedMs = Date.now();
    for (let i = 0; i < count; i++) {
      const sent: Promise<unknown> = publisher.publishAsync('calibration/a', payload, { qos: 1 }).finally(() => pending.delete(sent));
      pending.add(sent);
      if (pending.size >= 100) await Promise.race(pending);
    }
    while (received < count) await sleep(10);
    const perS = rate(count, Date.now() - startedMs);
    await Promise.all([publisher.endAsync(), subscriber.endAsync()]);
    return perS;
  } finally {
    await broker.stop();
  }
}

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
const rate = (count: number, ms: number) => Math.round(count / (ms / 1000));

/**
 * 1. The broker alone: a subscriber with the ingest's kind of session (persistent, QoS 1)
 * that acknowledges at once and stores nothing.
 */
async function brokerOnly(url: string, publisher: Publisher, baseMs: number): Promise<number> {
  const account = { clientId: 'cw-bench-null', username: TEST_INGEST.username, password: TEST_INGEST.password, protocolVersion: 4 as const };
  const subscriber = await mqtt.connectAsync(url, { ...account, clean: false });
  await subscriber.subscribeAsync('cw/v1/s/+/+/reading', { qos: 1 });
  let received = 0;
  let lastMs = 0;
  subscriber.on('message', () => {
    received++;
    lastMs = Date.now();
  });
  const startedMs = Date.now();
  await publisher.run({ count: READINGS, baseMs, firstSeq: 0 });
  while (received < READINGS) await sleep(20);
  await subscriber.endAsync();
  // A clean reconnect ends the session, so later runs queue nothing for it.
  await (await mqtt.connectAsync(url, { ...account, clean: true })).endAsync();
  return rate(READINGS, lastMs - startedMs);
}

/** 2. Ingest: from the first publish to the last committed row. */
async function ingestThroughput(worker: IngestWorker, publisher: Publisher, db: TestDatabase, baseMs: number): Promise<{ perS: number; stored: number }> {
  const before = worker.stats().stored;
  const startedMs = Date.now();
  await publisher.run({ count: READINGS, baseMs, firstSeq: 1_000_000 });
  while (worker.stats().stored - before < READINGS) await sleep(10);
  const elapsedMs = Date.now() - startedMs;
  const [row] = await db.dataSource.query('SELECT count(*)::int AS n FROM reading');
  return { perS: rate(READINGS, elapsedMs), stored: row.n };
}

/** 3. Latency at a paced rate: reading time is the publish time, the hook sees the commit. */
async function latency(publisher: Publisher, latencies: number[]): Promise<{ p50: number; p99: number; achievedPerS: number }> {
  latencies.length = 0;
  const count = LATENCY_RATE_PER_S * LATENCY_SECONDS;
  const { publishMs } = await publisher.run({ count, ratePerS: LATENCY_RATE_PER_S, timestamps: 'publish', firstSeq: 2_000_000 });
  while (latencies.length < count) await sleep(20);
  const sorted = [...latencies].sort((a, b) => a - b);
  return { p50: percentile(sorted, 50), p99: percentile(sorted, 99), achievedPerS: rate(count, publishMs) };
}

/** 4. A year of one-minute readings through the store, then the one-year history query. */
async function historyQuery(db: TestDatabase, device: TestDevice): Promise<{ p50: number; p95: number; points: number; resolution: string }> {
  const endMs = Math.floor(Date.now() / 60_000) * 60_000 - 10 * DAY_MS;
  const startMs = endMs - 365 * DAY_MS;
  const pool = new Pool({ connectionString: db.url, max: 1 });
  const client = await pool.connect();
  try {
    const partitions = new PartitionManager(pool);
    for (let atMs = startMs; atMs < endMs; atMs += 20_000 * 60_000) {
      const batch: StoredReading[] = [];
      for (let i = 0; i < 20_000 && atMs + i * 60_000 < endMs; i++) {
        const t = atMs + i * 60_000;
        const minute = t / 60_000;
        batch.push({ deviceId: device.deviceId, sensorId: device.sensorId, applianceId: device.applianceId, seq: minute, atMs: t, freshFoodC: Math.round((3 + Math.sin(minute / 7)) * 16) / 16, freezerC: -18.5, freshFoodFlag: null, freezerFlag: null, batteryV: null, doorOpen: null });
      }
      await partitions.ensureFor(client, [batch[0].atMs, batch[batch.length - 1].atMs]);
      await insertReadings(client, batch);
    }
  } finally {
    client.release();
    await pool.end();
  }
  await db.dataSource.query('ANALYZE');
  const service = new HistoryService<null>(db.dataSource, { assertCanReadAppliance: async () => undefined });
  const times: number[] = [];
  let last = await service.applianceHistory(null, device.applianceId, { fromMs: startMs, toMs: endMs });
  for (let i = 0; i < HISTORY_QUERIES + 5; i++) {
    const t0 = performance.now();
    last = await service.applianceHistory(null, device.applianceId, { fromMs: startMs + i * 60_000, toMs: endMs });
    if (i >= 5) times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), points: last.probes.fresh_food?.points.length ?? 0, resolution: `${last.resolution} (${last.source}, ${(last.bucketMs ?? 0) / 3_600_000} h buckets)` };
}

function report(lines: [string, string, string][]): string {
  const widths = [0, 1, 2].map((c) => Math.max(...lines.map((line) => line[c].length)));
  return lines.map((line) => line.map((cell, c) => cell.padEnd(widths[c])).join('  ').trimEnd()).join('\n');
}

async function main(): Promise<void> {
  const loadAtStart = os.loadavg().map((value) => value.toFixed(1)).join(' / ');
  const db = await createTestDatabase('cw_bench');
  const processes: ManagedProcess[] = [];
  let publisher: Publisher | null = null;
  let worker: IngestWorker | null = null;
  try {
    const calibrationPerS = await plainAedes();
    const placement = await createPlacement(db.dataSource);
    const devices: TestDevice[] = [];
    for (let i = 0; i < DEVICES; i++) devices.push(await createDevice(db.dataSource, placement));
    const port = await freePort();
    const { args, env } = nodeArgsFor('broker/main');
    const broker = startProcess('broker', process.execPath, [...PROFILE_ARGS, ...args], { ...env, DATABASE_URL: db.url, MQTT_PORT: String(port), MQTT_INGEST_PASSWORD: TEST_INGEST.password, LOG_LEVEL: 'warn' });
    processes.push(broker);
    await waitFor('starting', broker, () => tcpOpen(port));
    const url = `mqtt://127.0.0.1:${port}`;
    publisher = await startPublisher(devices.map((device) => ({ ...device, url })), publisherOptions);

    const baseMs = Date.now() - 30 * DAY_MS;
    const brokerPerS = await brokerOnly(url, publisher, baseMs);

    const latencies: number[] = [];
    worker = testWorker(url, db.url, ingestConfig({ clientId: 'cw-bench-ingest', ...(process.env.BENCH_MAX_UNACKED ? { maxUnacked: Number(process.env.BENCH_MAX_UNACKED) } : {}) }), (batch) => {
      for (const reading of batch.readings) if (reading.seq >= 2_000_000) latencies.push(batch.committedAtMs - reading.atMs);
    });
    await worker.start();
    const ingest = await ingestThroughput(worker, publisher, db, baseMs);
    const lag = await latency(publisher, latencies);
    await worker.stop();
    worker = null;
    publisher.stop();
    publisher = null;
    const history = process.env.BENCH_SKIP_HISTORY ? { p50: NaN, p95: NaN, points: 0, resolution: 'skipped' } : await historyQuery(db, devices[0]);

    const ratio = ingest.perS / brokerPerS;
    const table = report([
      ['figure', 'measured', 'target'],
      ['calibration: plain aedes, 1 publisher × 100 in flight (STACK.md: 37–42k on a quiet machine)', `${calibrationPerS.toLocaleString('en-US')} msg/s`, ''],
      ['broker alone, QoS 1 (persistent session) to a subscriber storing nothing', `${brokerPerS.toLocaleString('en-US')} readings/s`, '(reference)'],
      ['ingest, MQTT publish → committed rows, QoS 1', `${ingest.perS.toLocaleString('en-US')} readings/s`, '≥ 20,000/s and ≥ half the broker alone'],
      ['  ingest ÷ broker alone', `${(ratio * 100).toFixed(0)} %`, '≥ 50 %'],
      ['  rows stored / readings published', `${ingest.stored.toLocaleString('en-US')} / ${READINGS.toLocaleString('en-US')}`, 'equal (no loss)'],
      [`publish → stored latency at ${LATENCY_RATE_PER_S.toLocaleString('en-US')}/s (achieved ${lag.achievedPerS.toLocaleString('en-US')}/s)`, `p50 ${lag.p50} ms, p99 ${lag.p99} ms`, ''],
      ['history, one-year range of one-minute readings (server time)', `p50 ${history.p50.toFixed(1)} ms, p95 ${history.p95.toFixed(1)} ms`, 'p95 ≤ 50 ms'],
      ['  answer', `${history.points} points per probe, ${history.resolution}`, '≤ 2,000 points'],
    ]);
    // Other work on the machine shows in the load average; the figures scale with the CPU left over.
    const load = os.loadavg().map((value) => value.toFixed(1)).join(' / ');
    const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, Node ${process.version}, ${new Date().toISOString()}, load average at start ${loadAtStart}, at end ${load} (1/5/15 min)`;
    const text = `Ingest benchmark (${DEVICES} sensors, ${READINGS.toLocaleString('en-US')} readings per throughput run, ${WINDOW_PER_DEVICE} in flight per sensor)\n${machine}\n\n${table}\n`;
    console.log(text);
    fs.mkdirSync(path.dirname(NOTES_FILE), { recursive: true });
    fs.writeFileSync(NOTES_FILE, text);
    if (ingest.stored !== READINGS) process.exitCode = 1;
  } finally {
    await worker?.stop();
    publisher?.stop();
    await Promise.all(processes.map((p) => p.stop()));
    await db.drop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
