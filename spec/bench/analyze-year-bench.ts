/**
 * The logger-file analysis on a year of one-minute readings (issue 4: 525,600 rows in under
 * 3 s). Writes a simulated year (defrost, doors, hot days, a three-day evaporator-fan stop)
 * to a CSV file, then times the CLI exactly as a user runs it. Run:
 *   npx tsx --tsconfig server/tsconfig.json spec/bench/analyze-year-bench.ts [DIR]
 * (DIR defaults to .data/, which git ignores.) The machine is shared: the load average is
 * printed beside each figure, and user+system CPU time beside the wall-clock time.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import path from 'node:path';
import { defaultProfile, generateTrace } from '../../simulator/model';

const DAY_MS = 86_400_000;
const MINUTE_MS = 60_000;
const ROWS = 525_600;

function yearCsv(): string {
  const startMs = Date.UTC(2025, 0, 1);
  const trace = generateTrace({
    profile: defaultProfile('top-freezer'),
    seed: 7,
    startMs,
    durationMs: 365 * DAY_MS,
    intervalMs: MINUTE_MS,
    faults: [{ fault: 'evaporator-fan', startMs: startMs + 200 * DAY_MS, endMs: startMs + 203 * DAY_MS }],
  });
  // The simulator's clock jitters a little; one row per minute keeps the file at 525,600 rows.
  const byMinute = new Map(trace.map((s) => [Math.round((s.atMs - startMs) / MINUTE_MS), s]));
  const lines = ['timestamp,fresh_food_c,freezer_c'];
  for (let i = 0; i < ROWS; i++) {
    const s = byMinute.get(i);
    lines.push(`${new Date(startMs + i * MINUTE_MS).toISOString()},${s?.freshFoodC ?? ''},${s?.freezerC ?? ''}`);
  }
  return `${lines.join('\n')}\n`;
}

function timedRun(file: string): string {
  const load = loadavg()[0].toFixed(2);
  const run = spawnSync('/usr/bin/time', ['-f', '%e %U %S', 'npm', 'run', '--silent', 'analyze', '--', file], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  const [wall, user, sys] = run.stderr.trim().split('\n').pop()!.split(' ').map(Number);
  const findings = (JSON.parse(run.stdout) as { findings: unknown[] }).findings.length;
  return `wall ${wall.toFixed(2)} s, cpu ${(user + sys).toFixed(2)} s (load average ${load} before), ${findings} findings`;
}

const dir = process.argv[2] ?? path.join(process.cwd(), '.data');
mkdirSync(dir, { recursive: true });
const file = path.join(dir, 'analyze-year.csv');
writeFileSync(file, yearCsv());
console.log(`${file}: ${ROWS} rows`);
execFileSync('npm', ['run', '--silent', 'analyze', '--', file], { stdio: 'ignore', maxBuffer: 64 * 1024 * 1024 }); // builds the server if stale, warms the file cache
for (let i = 1; i <= 3; i++) console.log(`run ${i}: ${timedRun(file)}`);
