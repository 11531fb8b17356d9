/**
 * Why the logger reader scans by hand: a year of one-minute rows (525,600) parsed with
 * csv-parse 6.2.0 (sync API, the fastest of its interfaces) versus the hand-written scanner
 * of server/detection/logger-csv.ts, on the same text. Run:
 *   npx tsx --tsconfig server/tsconfig.json spec/bench/csv-read-bench.ts
 */
import { parse } from 'csv-parse/sync';
import { parseLoggerCsv } from '../../server/detection/logger-csv';

const ROWS = 525_600;

function yearOfRows(): string {
  const start = Date.UTC(2025, 0, 1);
  const lines = ['timestamp,fresh_food_c,freezer_c'];
  for (let i = 0; i < ROWS; i++) {
    const fresh = (3 + Math.sin(i / 20)).toFixed(2);
    const freezer = (-18 + 1.5 * Math.sin(i / 30)).toFixed(2);
    lines.push(`${new Date(start + i * 60_000).toISOString()},${fresh},${freezer}`);
  }
  return `${lines.join('\n')}\n`;
}

function timed(label: string, work: () => number): void {
  const startedMs = performance.now();
  const rows = work();
  console.log(`${label.padEnd(44)} ${(performance.now() - startedMs).toFixed(0).padStart(6)} ms  (${rows} rows)`);
}

const text = yearOfRows();
timed('csv-parse 6.2.0 sync + Date.parse + Number', () => {
  const records = parse(text, { columns: true, skip_empty_lines: true }) as Record<string, string>[];
  let sum = 0;
  for (const r of records) sum += Date.parse(r.timestamp) + Number(r.fresh_food_c) + Number(r.freezer_c);
  return Number.isFinite(sum) ? records.length : 0;
});
timed('hand scanner (logger-csv.ts)', () => parseLoggerCsv(text).series.atMs.length);
