/**
 * The demo seed in a real database: deterministic from the seed number (device secrets
 * aside), and the scenario's promised shape on first sign-in. One full seed (the months of
 * history, about half a million readings) is shared by the shape checks.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { seedDatabase } from '../../seeds/run';
import { DEMO_ACCOUNTS } from '../../seeds/demo-accounts';
import { liveStartMsOf } from '../../seeds/scenario/faults';
import { DEFAULT_SCENARIO_SEED, planScenario } from '../../seeds/scenario/plan';
import { readFleetFile, SIMULATOR_STATE_FILE_NAME } from '../../simulator/cli/fleet';
import type { ResumeState } from '../../simulator/cli/fleet-runner';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

const NOW_MS = Date.UTC(2026, 11, 1, 18, 3);
const FULL_SEED_TIMEOUT_MS = 600_000;

/** One fingerprint per table over its natural keys, leaving out generated ids, random secrets and insertion times. */
const FINGERPRINTS: Record<string, string> = {
  properties: `SELECT name, address_line1, city, postal_code, time_zone FROM property`,
  units: `SELECT p.name, u.label, u.floor FROM unit u JOIN property p ON p.id = u.property_id`,
  appliances: `SELECT u.label, a.style, a.model, a.serial, a.installed_on, a.warranty_ends_on FROM appliance a JOIN unit u ON u.id = a.unit_id`,
  sensors: `SELECT device_id, interval_seconds, created_at, last_seen_at FROM sensor`,
  users: `SELECT a.email, a.role, a.is_admin, a.display_name, u.label FROM app_user a LEFT JOIN unit u ON u.id = a.unit_id`,
  coverage: `SELECT p.name, c.name, v.rank FROM coverage v JOIN property p ON p.id = v.property_id JOIN contractor c ON c.id = v.contractor_id`,
  readings: `SELECT s.device_id, r.at, r.seq, r.fresh_food_c, r.freezer_c, r.fresh_food_flag, r.freezer_flag, r.battery_v, r.door_open FROM reading r JOIN sensor s ON s.id = r.sensor_id`,
  rollups: `SELECT a.serial, r.bucket, r.fresh_food_sum, r.freezer_sum, r.reading_count FROM reading_rollup_1h r JOIN appliance a ON a.id = r.appliance_id`,
  findings: `SELECT a.serial, f.kind, f.compartment, f.started_at, f.detected_at, f.ended_at, f.severity, f.probable_causes FROM finding f LEFT JOIN appliance a ON a.id = f.appliance_id`,
  monitor: `SELECT a.serial, m.health, m.last_reading_at, m.engine_state FROM appliance_monitor m JOIN appliance a ON a.id = m.appliance_id`,
  workOrders: `SELECT r.title, r.status, w.state, w.dispatched_at, w.completed_at, w.verified_at, w.cause_found FROM work_order w JOIN service_request r ON r.id = w.service_request_id`,
};

async function fingerprints(dataSource: DataSource): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const [name, sql] of Object.entries(FINGERPRINTS)) {
    const [row] = await dataSource.query(`SELECT count(*)::int AS n, md5(coalesce(string_agg(t::text, '|' ORDER BY t::text), '')) AS digest FROM (${sql}) t`);
    out[name] = `${row.n}:${row.digest}`;
  }
  return out;
}

async function seeded(name: string, args: { seed: number; historyDays?: number }): Promise<{ db: TestDatabase; dataDir: string }> {
  const db = await createTestDatabase(name);
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-seed-'));
  await seedDatabase(db.dataSource, { reset: false, nowMs: NOW_MS, ...args }, dataDir);
  return { db, dataDir };
}

async function one<T>(dataSource: DataSource, sql: string, params: unknown[] = []): Promise<T> {
  const [row] = await dataSource.query(sql, params);
  return row as T;
}

describe('demo seed in the database', () => {
  it('writes the same rows from the same seed and "now" (device secrets aside), other rows from another seed', async () => {
    spyOn(console, 'log'); // the seed runner narrates each step
    const [a, b, c] = [await seeded('cw_seed_a', { seed: 11, historyDays: 1 }), await seeded('cw_seed_b', { seed: 11, historyDays: 1 }), await seeded('cw_seed_c', { seed: 12, historyDays: 1 })];
    try {
      const [printA, printB, printC] = [await fingerprints(a.db.dataSource), await fingerprints(b.db.dataSource), await fingerprints(c.db.dataSource)];
      expect(printB).toEqual(printA);
      expect(Number(printA.readings.split(':')[0])).toBeGreaterThan(1000);
      expect(printC.readings).not.toBe(printA.readings);
      expect(printC.appliances).not.toBe(printA.appliances);
      const [fleetA, fleetB] = [readFleetFile(path.join(a.dataDir, 'fleet.json')), readFleetFile(path.join(b.dataDir, 'fleet.json'))];
      expect(fleetB.devices.map((d) => d.deviceId)).toEqual(fleetA.devices.map((d) => d.deviceId));
      expect(fleetB.devices[0].secret).not.toBe(fleetA.devices[0].secret);
    } finally {
      for (const { db, dataDir } of [a, b, c]) {
        await db.drop();
        fs.rmSync(dataDir, { recursive: true, force: true });
      }
    }
  }, FULL_SEED_TIMEOUT_MS);

  describe('the full scenario', () => {
    let db: TestDatabase;
    let dataDir: string;
    let ds: DataSource;

    beforeAll(async () => {
      spyOn(console, 'log'); // the seed runner narrates each step
      ({ db, dataDir } = await seeded('cw_seed_full', { seed: DEFAULT_SCENARIO_SEED }));
      ds = db.dataSource;
    }, FULL_SEED_TIMEOUT_MS);
    afterAll(async () => {
      await db?.drop();
      fs.rmSync(dataDir, { recursive: true, force: true });
    });

    it('has one company with a 40-unit building and appliances past their expected life', async () => {
      expect((await one<{ n: number }>(ds, `SELECT count(*)::int AS n FROM organization`)).n).toBe(1);
      const biggest = await one<{ n: number }>(ds, `SELECT count(*)::int AS n FROM unit GROUP BY property_id ORDER BY 1 DESC LIMIT 1`);
      expect(biggest.n).toBe(40);
      // Expected service life: refrigerator 13 years, freezer 11 (NAHB / Bank of America Home Equity, 2007).
      const aged = await one<{ fridges: number; freezers: number }>(
        ds,
        `SELECT count(*) FILTER (WHERE style NOT IN ('upright-freezer','chest-freezer') AND installed_on < $1::date - interval '13 years')::int AS fridges,
                count(*) FILTER (WHERE style IN ('upright-freezer','chest-freezer') AND installed_on < $1::date - interval '11 years')::int AS freezers FROM appliance`,
        [new Date(NOW_MS)],
      );
      expect(aged.fridges).toBeGreaterThanOrEqual(2);
      expect(aged.freezers).toBeGreaterThanOrEqual(1);
    });

    it('gives every property a primary and a different backup contractor', async () => {
      const rows: { primaries: number; backups: number; distinct_contractors: number }[] = await ds.query(
        `SELECT count(*) FILTER (WHERE rank = 'primary')::int AS primaries, count(*) FILTER (WHERE rank = 'backup')::int AS backups, count(DISTINCT contractor_id)::int AS distinct_contractors
           FROM property p LEFT JOIN coverage c ON c.property_id = p.id GROUP BY p.id`,
      );
      expect(rows.length).toBe(planScenario(DEFAULT_SCENARIO_SEED, NOW_MS).properties.length);
      for (const row of rows) expect(row).toEqual({ primaries: 1, backups: 1, distinct_contractors: 2 });
    });

    it('has weeks to months of readings for every appliance, with rollups that add up', async () => {
      const spans: { days: number }[] = await ds.query(`SELECT extract(epoch FROM max(at) - min(at)) / 86400 AS days FROM reading GROUP BY appliance_id`);
      expect(spans.length).toBe((await one<{ n: number }>(ds, `SELECT count(*)::int AS n FROM appliance`)).n);
      expect(Math.min(...spans.map((s) => Number(s.days)))).toBeGreaterThanOrEqual(21);
      expect(Math.max(...spans.map((s) => Number(s.days)))).toBeGreaterThanOrEqual(89);
      const sums = await one<{ raw: number; hourly: number; five: number }>(
        ds,
        `SELECT (SELECT count(*)::int FROM reading) AS raw, (SELECT sum(reading_count)::int FROM reading_rollup_1h) AS hourly, (SELECT sum(reading_count)::int FROM reading_rollup_5m) AS five`,
      );
      expect(sums.hourly).toBe(sums.raw);
      expect(sums.five).toBe(sums.raw);
    });

    it('has past incidents found by the monitor, each repair a verified work order with parts, labour and an approved cost', async () => {
      const jobs: { state: string; status: string; parts_cents: number; labour_cents: number; cost_status: string; incident_closed: boolean; events: number }[] = await ds.query(
        `SELECT w.state, r.status, w.cost_status, (i.closed_at IS NOT NULL) AS incident_closed,
                (SELECT sum(quantity * unit_cost_cents)::int FROM work_order_part p WHERE p.work_order_id = w.id) AS parts_cents,
                (SELECT sum(minutes * hourly_rate_cents / 60)::int FROM work_order_labour l WHERE l.work_order_id = w.id) AS labour_cents,
                (SELECT count(*)::int FROM work_order_event e WHERE e.work_order_id = w.id) AS events
           FROM work_order w JOIN service_request r ON r.id = w.service_request_id JOIN incident i ON i.id = r.incident_id`,
      );
      expect(jobs.length).toBeGreaterThanOrEqual(4);
      for (const job of jobs) {
        expect(job).toEqual(jasmine.objectContaining({ state: 'verified', status: 'closed', cost_status: 'approved', incident_closed: true, events: 6 }));
        expect(job.parts_cents).toBeGreaterThan(0);
        expect(job.labour_cents).toBeGreaterThan(0);
      }
      expect((await one<{ n: number }>(ds, `SELECT count(*)::int AS n FROM incident WHERE closed_at IS NULL`)).n).toBe(0);
    });

    it('leaves the live monitor a learned normal for every appliance and the simulator where the history ends', async () => {
      expect((await one<{ n: number }>(ds, `SELECT count(*)::int AS n FROM appliance_monitor`)).n).toBe((await one<{ n: number }>(ds, `SELECT count(*)::int AS n FROM appliance`)).n);
      const state = JSON.parse(fs.readFileSync(path.join(dataDir, SIMULATOR_STATE_FILE_NAME), 'utf8')) as ResumeState;
      const liveStartMs = liveStartMsOf(planScenario(DEFAULT_SCENARIO_SEED, NOW_MS));
      const fleet = readFleetFile(path.join(dataDir, 'fleet.json'));
      for (const device of fleet.devices) expect(state[device.deviceId]?.lastAtMs).withContext(device.deviceId).toBe(liveStartMs);
      const newest = await one<{ at: Date }>(ds, `SELECT max(at) AS at FROM reading`);
      expect(newest.at.getTime()).toBe(liveStartMs);
    });

    it('puts the demo tenant in the unit whose evaporator fan fails in the storyline', async () => {
      const tenant = DEMO_ACCOUNTS.find((account) => account.role === 'tenant')!;
      const row = await one<{ label: string; property: string }>(
        ds,
        `SELECT u.label, p.name AS property FROM app_user a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id WHERE a.email = $1`,
        [tenant.email],
      );
      expect(row).toEqual({ label: '304', property: 'Harrowgate Commons' });
      expect((await one<{ n: number }>(ds, `SELECT count(*)::int AS n FROM app_user WHERE role = 'tenant'`)).n).toBeGreaterThan(3);
    });
  });
});
