/**
 * Live monitor benchmark, run by `npm run bench` or on its own:
 *   TSX_TSCONFIG_PATH=server/tsconfig.json npx tsx spec/bench/monitor-bench.ts
 * against a throwaway database. A fleet of BENCH_APPLIANCES (default 500) appliances in
 * properties of 20 reports every 5 minutes for BENCH_HOURS (default 24) hours; the readings
 * reach MonitorService.handleBatch in ingest-sized batches (2,000, interleaved by time as a
 * fleet reports). Figures: readings judged per second (engine, incident tracker and the
 * per-batch writes of state, findings and incidents), batch time p50/p95, the stored
 * state per appliance, and the first batch after a restart (state loaded from the table).
 */
import 'reflect-metadata';
import pino from 'pino';
import type { StoredReading } from '../../server/ingest/store';
import { EventBus } from '../../server/events/bus';
import { MonitorService } from '../../server/monitor/monitor-service';
import { createRng, gaussian } from '../../simulator/model';
import { createTestDatabase } from '../support/test-db';

const APPLIANCES = Number(process.env.BENCH_APPLIANCES ?? 500);
const HOURS = Number(process.env.BENCH_HOURS ?? 24);
const PER_PROPERTY = 20;
const INTERVAL_MS = 5 * 60_000;
const BATCH = 2000;
const logger = pino({ level: 'silent' });

async function seed(db: Awaited<ReturnType<typeof createTestDatabase>>): Promise<string[]> {
  const [{ id: org }] = await db.dataSource.query(`INSERT INTO organization (name) VALUES ('Bench Rentals') RETURNING id`);
  await db.dataSource.query(
    `INSERT INTO property (organization_id, name, address_line1, city, time_zone)
     SELECT $1, 'Bench ' || n, n || ' Example Street', 'Benchville', 'UTC' FROM generate_series(1, $2) n`,
    [org, Math.ceil(APPLIANCES / PER_PROPERTY)],
  );
  const rows: { id: string }[] = await db.dataSource.query(
    `WITH u AS (INSERT INTO unit (property_id, label) SELECT p.id, 'U' || n FROM property p, generate_series(1, $1) n RETURNING id),
          a AS (INSERT INTO appliance (unit_id, style) SELECT id, 'top-freezer' FROM u LIMIT $2 RETURNING id),
          s AS (INSERT INTO sensor (device_id, appliance_id, secret_hash, interval_seconds) SELECT 'cw-bench-' || row_number() OVER (), id, 'x', 300 FROM a RETURNING appliance_id)
     SELECT appliance_id AS id FROM s`,
    [PER_PROPERTY, APPLIANCES],
  );
  return rows.map((row) => row.id);
}

/** A healthy cabinet: compressor cycles of about 40 minutes, probe noise, each unit with its own set point. */
function readingsAt(atMs: number, appliances: string[], setpoints: number[], rng: () => number): StoredReading[] {
  const phase = (atMs / (40 * 60_000)) * 2 * Math.PI;
  return appliances.map((applianceId, i) => ({
    deviceId: `cw-bench-${i}`,
    seq: 0,
    atMs,
    freshFoodC: Math.round((setpoints[i] + 0.6 * Math.sin(phase + i) + 0.05 * gaussian(rng)) * 16) / 16,
    freezerC: Math.round((-18 + 1.2 * Math.sin(phase + i) + 0.08 * gaussian(rng)) * 16) / 16,
    freshFoodFlag: null,
    freezerFlag: null,
    batteryV: 3,
    doorOpen: false,
    sensorId: applianceId,
    applianceId,
  }));
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
}

async function main(): Promise<void> {
  const db = await createTestDatabase('cw_bench_monitor');
  try {
    const appliances = await seed(db);
    const rng = createRng(3);
    const setpoints = appliances.map(() => 2 + 2 * rng());
    const startMs = Date.now() - HOURS * 3_600_000;
    const steps = Math.floor((HOURS * 3_600_000) / INTERVAL_MS);
    const all: StoredReading[] = [];
    for (let step = 0; step < steps; step++) all.push(...readingsAt(startMs + step * INTERVAL_MS, appliances, setpoints, rng));
    const bus = new EventBus(logger);
    const clock = { now: () => new Date(startMs + steps * INTERVAL_MS) };
    const monitor = new MonitorService({ dataSource: db.dataSource, bus, logger, clock });
    const batchMs: number[] = [];
    const started = performance.now();
    for (let i = 0; i < all.length; i += BATCH) {
      const batch = all.slice(i, i + BATCH).sort((a, b) => (a.applianceId as string).localeCompare(b.applianceId as string) || a.atMs - b.atMs);
      const t = performance.now();
      await monitor.handleBatch({ readings: batch, committedAtMs: Date.now() });
      batchMs.push(performance.now() - t);
    }
    const seconds = (performance.now() - started) / 1000;
    batchMs.sort((a, b) => a - b);
    const [size] = await db.dataSource.query(`SELECT avg(pg_column_size(engine_state))::int AS engine, avg(pg_column_size(tracker_state))::int AS tracker FROM appliance_monitor`);
    const [findings] = await db.dataSource.query(`SELECT count(*)::int AS n FROM finding WHERE kind <> 'sensor-fault'`);

    const restarted = new MonitorService({ dataSource: db.dataSource, bus, logger, clock });
    const next = readingsAt(startMs + steps * INTERVAL_MS, appliances, setpoints, rng);
    const t = performance.now();
    await restarted.handleBatch({ readings: next, committedAtMs: Date.now() });
    const restartMs = performance.now() - t;

    console.log(`monitor: ${appliances.length} appliances, ${HOURS} h of 5-minute readings = ${all.length} readings in batches of ${BATCH}`);
    console.log(`  judged and stored: ${Math.round(all.length / seconds)} readings/s (${seconds.toFixed(1)} s)`);
    console.log(`  batch time: p50 ${percentile(batchMs, 0.5).toFixed(0)} ms, p95 ${percentile(batchMs, 0.95).toFixed(0)} ms`);
    console.log(`  stored state per appliance: engine ${size.engine} B, tracker ${size.tracker} B (jsonb, compressed as stored)`);
    console.log(`  first batch after a restart (${appliances.length} states loaded): ${restartMs.toFixed(0)} ms`);
    console.log(`  repair findings on healthy synthetic traces: ${findings.n}`);
  } finally {
    await db.drop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
