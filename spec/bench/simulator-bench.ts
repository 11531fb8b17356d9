/**
 * Speed of generateTrace (a benchmark, not a unit test). Targets from the simulator's issue:
 * a year at one-minute interval in a few seconds at most, a week at five minutes in milliseconds.
 * Run: TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx spec/bench/simulator-bench.ts
 */
import { defaultProfile, generateTrace } from '../../simulator/model';
import type { ApplianceStyle } from '../../shared/domain';

const DAY_MS = 86_400_000;
const START_MS = Date.UTC(2026, 0, 5);

function timeTrace(style: ApplianceStyle, days: number, intervalMs: number): { samples: number; ms: number } {
  const begin = performance.now();
  const trace = generateTrace({ profile: defaultProfile(style), seed: 1, startMs: START_MS, durationMs: days * DAY_MS, intervalMs });
  return { samples: trace.length, ms: performance.now() - begin };
}

// Warm the JIT so the week figure measures the model, not the compiler (a cold first week
// takes 100–200 ms).
for (let i = 0; i < 4; i++) timeTrace('top-freezer', 7, 300_000);
const rows: [string, { samples: number; ms: number }, number][] = [
  ['week, 5-min, top-freezer', timeTrace('top-freezer', 7, 300_000), 100],
  ['week, 1-min, top-freezer', timeTrace('top-freezer', 7, 60_000), 200],
  ['year, 1-min, top-freezer', timeTrace('top-freezer', 365, 60_000), 5000],
  ['year, 1-min, chest-freezer', timeTrace('chest-freezer', 365, 60_000), 5000],
];
console.log('\nSimulator generateTrace (20 s physics step)');
for (const [name, { samples, ms }, targetMs] of rows) {
  const verdict = ms < targetMs ? `target < ${targetMs} ms: met` : `target < ${targetMs} ms: MISSED`;
  console.log(`  ${name.padEnd(28)} ${String(samples).padStart(7)} samples ${ms.toFixed(0).padStart(6)} ms  ${verdict}`);
}
