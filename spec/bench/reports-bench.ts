/**
 * GET /api/reports over the last twelve months with 5,000 appliances: an organization of
 * 50 properties × 100 units with about 10,000 incidents, 6,000 requests, 6,600 work orders
 * and their parts and labour, plus a second organization of 2,000 appliances with the same
 * history that every statement must skip. Seeded set-based into a throwaway database; the
 * real app answers a signed-in manager. Reports p50/p95 of the whole request (all six
 * statements), of one property, and of one CSV download.
 * Target (ours): p95 of the whole report under 1,000 ms.
 */
import 'reflect-metadata';
import os from 'node:os';
import bcrypt from 'bcryptjs';
import pino from 'pino';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { probe } from '../../server/services/health';
import { Browser } from '../auth/support/browser';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

const ROUNDS = 12;
const TARGET_P95_MS = 1_000;

async function seedOrganization(db: TestDatabase, name: string, properties: number, unitsPerProperty: number): Promise<string> {
  const q = (sql: string, params: unknown[]) => db.dataSource.query(sql, params);
  const [{ id: org }] = await q(`INSERT INTO organization (name) VALUES ($1) RETURNING id`, [name]);
  await q(
    `INSERT INTO property (organization_id, name, address_line1, city, time_zone)
     SELECT $1, 'Bench Court ' || lpad(n::text, 3, '0'), n || ' Example Street', 'Benchville', 'America/Chicago' FROM generate_series(1, $2) n`,
    [org, properties],
  );
  await q(`INSERT INTO unit (property_id, label) SELECT p.id, 'U' || n FROM property p, generate_series(1, $2) n WHERE p.organization_id = $1`, [org, unitsPerProperty]);
  const styles = `(ARRAY['top-freezer','bottom-freezer','side-by-side','fresh-food-only','upright-freezer','chest-freezer'])`;
  await q(
    `INSERT INTO appliance (unit_id, style, installed_on, created_at)
     SELECT u.id, ${styles}[1 + (hashtext(u.id::text) & 1023) % 6], current_date - ((hashtext(u.id::text) & 8191) % 6000), now() - interval '3 years'
       FROM unit u JOIN property p ON p.id = u.property_id WHERE p.organization_id = $1`,
    [org],
  );
  // Two incidents a year per appliance, spread over the last twelve months.
  await q(
    `INSERT INTO incident (organization_id, property_id, unit_id, appliance_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at, closed_at, severity, top_cause, probable_causes, updated_at)
     SELECT $1, u.property_id, u.id, a.id, 'appliance', 'bench-' || k, 'repair', 'over-temperature', ARRAY['over-temperature'],
            now() - ((hashtext(a.id::text || k) & 1023) % 360 || ' days')::interval, now() - ((hashtext(a.id::text || k) & 1023) % 360 || ' days')::interval, now(),
            'urgent', (ARRAY['evaporator-fan','defrost-system','condenser-airflow','compressor-start','door-seal'])[1 + (hashtext(a.id::text || k) & 7) % 5], '[]', now()
       FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id, generate_series(1, 2) k
      WHERE p.organization_id = $1`,
    [org],
  );
  const [{ id: contractor }] = await q(`INSERT INTO contractor (organization_id, name, email) VALUES ($1, 'Bench Repair', 'bench@example.com') RETURNING id`, [org]);
  // A request for 60 % of the incidents, a work order for each, a second (after a decline) for one in ten.
  await q(
    `INSERT INTO service_request (organization_id, property_id, unit_id, appliance_id, level, source, status, priority, title, incident_id, opened_at)
     SELECT i.organization_id, i.property_id, i.unit_id, i.appliance_id, 'appliance', 'monitor', 'closed', 'urgent', 'bench', i.id, i.opened_at + interval '30 minutes'
       FROM incident i WHERE i.organization_id = $1 AND (hashtext(i.id::text) & 1023) % 10 < 6`,
    [org],
  );
  await q(
    `INSERT INTO work_order (organization_id, service_request_id, contractor_id, state, priority, dispatch_method, dispatched_at, due_at, completed_at, verified_at, reopened_count, cause_found, cost_status)
     SELECT r.organization_id, r.id, $2, 'verified', 'urgent', 'coverage-primary', r.opened_at + interval '1 hour', r.opened_at + interval '1 day',
            r.opened_at + interval '20 hours', r.opened_at + interval '44 hours', (hashtext(r.id::text) & 7) / 7, 'evaporator-fan',
            (ARRAY['approved','pending','approved'])[1 + (hashtext(r.id::text) & 3) % 3]
       FROM service_request r WHERE r.organization_id = $1`,
    [org, contractor],
  );
  await q(
    `INSERT INTO work_order (organization_id, service_request_id, contractor_id, state, priority, dispatch_method, dispatched_at, due_at)
     SELECT r.organization_id, r.id, $2, 'declined', 'urgent', 'coverage-primary', r.opened_at + interval '40 minutes', r.opened_at + interval '1 day'
       FROM service_request r WHERE r.organization_id = $1 AND (hashtext(r.id::text) & 1023) % 10 = 0`,
    [org, contractor],
  );
  await q(
    `INSERT INTO work_order_part (work_order_id, name, quantity, unit_cost_cents, currency, created_at)
     SELECT w.id, 'bench part', 1 + k % 2, 2500 + (hashtext(w.id::text) & 4095), 'USD', w.completed_at
       FROM work_order w, generate_series(1, 2) k WHERE w.organization_id = $1 AND w.completed_at IS NOT NULL`,
    [org],
  );
  await q(
    `INSERT INTO work_order_labour (work_order_id, minutes, hourly_rate_cents, currency, created_at)
     SELECT w.id, 30 + (hashtext(w.id::text) & 63), 9500, 'USD', w.completed_at FROM work_order w WHERE w.organization_id = $1 AND w.completed_at IS NOT NULL`,
    [org],
  );
  return org;
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

async function measure(browser: Browser, path: string): Promise<{ path: string; p50: number; p95: number; kb: number }> {
  const wallMs: number[] = [];
  let size = 0;
  for (let i = 0; i < ROUNDS + 2; i++) {
    const startedMs = performance.now();
    const res = await browser.get(path);
    const elapsedMs = performance.now() - startedMs;
    if (res.status !== 200) throw new Error(`${path}: ${res.status} ${JSON.stringify(res.body)}`);
    if (i < 2) continue; // warm-up
    wallMs.push(elapsedMs);
    size = (res.text ?? '').length;
  }
  wallMs.sort((a, b) => a - b);
  return { path, p50: percentile(wallMs, 50), p95: percentile(wallMs, 95), kb: size / 1024 };
}

async function count(db: TestDatabase, table: string, org: string): Promise<number> {
  const [{ n }] = await db.dataSource.query(`SELECT count(*)::int AS n FROM ${table} WHERE organization_id = $1`, [org]);
  return n;
}

async function main(): Promise<void> {
  const db = await createTestDatabase('cw_bench_reports');
  try {
    const seedStartedMs = performance.now();
    const org = await seedOrganization(db, 'Bench Holdings', 50, 100);
    await seedOrganization(db, 'Other Bench Lettings', 20, 100);
    await db.dataSource.query('ANALYZE');
    const [{ id: propertyId }] = await db.dataSource.query(`SELECT id FROM property WHERE organization_id = $1 ORDER BY name LIMIT 1`, [org]);
    const email = 'bench.manager@example.com';
    await db.dataSource.query(`INSERT INTO app_user (email, display_name, role, organization_id, password_hash) VALUES ($1, 'Bench Manager', 'manager', $2, $3)`, [email, org, await bcrypt.hash('bench-passphrase', 4)]);
    const seedSeconds = (performance.now() - seedStartedMs) / 1000;

    const config = { ...loadConfig({ NODE_ENV: 'test' }), clientDir: '/nonexistent' };
    const app = createApp({ config, dataSource: db.dataSource, logger: pino({ level: 'silent' }), brokerProbe: () => probe(async () => 'none'), version: 'bench', accounts: { passwordHashRounds: 4 } });
    const browser = new Browser(app);
    if ((await browser.signIn(email, 'bench-passphrase')).status !== 200) throw new Error('bench manager could not sign in');

    const results = [];
    for (const path of ['/api/reports', `/api/reports?propertyId=${propertyId}`, '/api/reports/spend-by-appliance.csv']) results.push(await measure(browser, path));

    const [incidents, requests, workOrders] = [await count(db, 'incident', org), await count(db, 'service_request', org), await count(db, 'work_order', org)];
    console.log(`\nReports: 5,000 appliances, ${incidents} incidents, ${requests} requests, ${workOrders} work orders (+ another organization of 2,000 appliances), seeded in ${seedSeconds.toFixed(1)} s; ${ROUNDS} requests each`);
    console.log(`  ${'request'.padEnd(72)} ${'p50/p95 ms'.padStart(16)} ${'body kB'.padStart(8)}`);
    for (const r of results) console.log(`  ${r.path.padEnd(72)} ${`${r.p50.toFixed(1)} / ${r.p95.toFixed(1)}`.padStart(16)} ${r.kb.toFixed(0).padStart(8)}`);
    console.log(`  load average during the run: ${os.loadavg().map((load) => load.toFixed(1)).join(' / ')} (1/5/15 min) on ${os.cpus().length} cores`);
    console.log(`  whole report p95 ${results[0].p95.toFixed(1)} ms: target < ${TARGET_P95_MS} ms ${results[0].p95 < TARGET_P95_MS ? 'met' : 'MISSED'}`);
  } finally {
    await db.drop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
