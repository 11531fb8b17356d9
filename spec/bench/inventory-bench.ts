/**
 * `npm run bench inventory`: the costs a manager waits for on the inventory and logger pages.
 * - a logger upload's server work (read, engine, LTTB chart) for 90 days and a year of
 *   one-minute readings: it runs on the request, so it is the pause that upload costs;
 * - a 5,000-row inventory CSV: preview, then the all-or-nothing write;
 * - attaching 30 days of one-minute readings to an appliance's history.
 */
import pino from 'pino';
import type { Actor } from '../../server/auth/actor';
import { analyzeSeries } from '../../server/detection/analyze';
import { parseLoggerCsv } from '../../server/detection/logger-csv';
import { InventoryImportService } from '../../server/services/inventory-import';
import { chartOf } from '../../server/services/logger-chart';
import { LoggerHistoryImporter } from '../../server/services/logger-history';
import { createTestDatabase } from '../support/test-db';
import { traceCsv } from '../inventory/support/logger-fixtures';

const ms = (startMs: number) => `${(performance.now() - startMs).toFixed(0)} ms`;

function loggerUpload(days: number): void {
  const file = traceCsv({ days, intervalMinutes: 1, seed: 5 });
  const started = performance.now();
  const parsed = parseLoggerCsv(file.text);
  const readMs = performance.now() - started;
  const analysis = analyzeSeries(parsed.series, 'top-freezer');
  const chart = chartOf(parsed.series);
  const total = performance.now() - started;
  const chartKb = JSON.stringify(chart).length / 1024;
  console.log(`  logger upload, ${days} d × 1 min (${(file.text.length / 1048576).toFixed(1)} MB, ${file.rows} rows): read ${readMs.toFixed(0)} ms, total ${total.toFixed(0)} ms, ${analysis.findings.length} findings, chart ${chartKb.toFixed(0)} kB`);
}

function inventoryCsv(rows: number): string {
  const lines = ['property_name,address_line1,city,time_zone,unit_label,floor,appliance_style,model,serial'];
  for (let i = 0; i < rows; i++) {
    const building = Math.floor(i / 250);
    lines.push(`Bench Block ${building},${building} Example Way,Springfield,America/Chicago,${i % 250},${Math.floor((i % 250) / 10)},top-freezer,TF-${i},SN-BENCH-${i}`);
  }
  return lines.join('\n');
}

async function inventoryImport(): Promise<void> {
  const db = await createTestDatabase('cw_bench_inventory');
  try {
    const [org] = await db.dataSource.query(`INSERT INTO organization (name) VALUES ('Bench Homes') RETURNING id`);
    const [user] = await db.dataSource.query(`INSERT INTO app_user (email, display_name, role, organization_id) VALUES ('bench@example.com', 'Bench Manager', 'manager', $1) RETURNING id`, [org.id]);
    const actor = { id: user.id, role: 'manager', isAdmin: false, organizationId: org.id } as Actor;
    const imports = new InventoryImportService(db.dataSource, pino({ level: 'silent' }));
    const text = inventoryCsv(5000);
    let started = performance.now();
    const preview = await imports.preview(actor, 'bench.csv', text);
    console.log(`  inventory preview, 5,000 rows (${(text.length / 1024).toFixed(0)} kB): ${ms(started)}, would create ${preview.create.properties} properties, ${preview.create.units} units, ${preview.create.appliances} appliances`);
    started = performance.now();
    const job = await imports.start(actor, 'bench.csv', text);
    await imports.idle();
    const done = imports.status(actor, job.id);
    console.log(`  inventory import, 5,000 rows: ${ms(started)} (${done.state}, ${done.processed} records)`);

    const [appliance] = await db.dataSource.query(`SELECT a.id FROM appliance a LIMIT 1`);
    const month = traceCsv({ days: 30, intervalMinutes: 1, seed: 9 });
    const [file] = await db.dataSource.query(
      `INSERT INTO logger_file (organization_id, file_name, size_bytes, content_sha256, content, style, readings, analysis, chart)
       VALUES ($1, 'bench.csv', $2, 'bench', $3, 'top-freezer', $4, '{}', '{}') RETURNING id`,
      [org.id, month.text.length, month.text, month.rows],
    );
    const importer = new LoggerHistoryImporter(db.dataSource);
    started = performance.now();
    const outcome = await importer.attach(org.id, actor.id, file.id, appliance.id);
    console.log(`  attach 30 d × 1 min (${month.rows} readings) to a history: ${ms(started)}, ${outcome.inserted} inserted`);
    started = performance.now();
    const again = await importer.attach(org.id, actor.id, file.id, appliance.id);
    console.log(`  attach the same file again: ${ms(started)}, ${again.inserted} inserted`);
  } finally {
    await db.drop();
  }
}

async function main(): Promise<void> {
  console.log('\nInventory and logger files');
  loggerUpload(90);
  loggerUpload(365);
  await inventoryImport();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
