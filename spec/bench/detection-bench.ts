/**
 * Quality benchmark of the detection engine (issue 4), run by `npm run bench:detection`.
 * A fixed, seeded set of simulated traces; the same figures for a plain thermometer alarm
 * as the baseline to beat. BENCH_SEED picks another trace set (do not tune to one seed);
 * BENCH_SCALE=0.25 runs a quarter of it for a quick look.
 */
import { evaluateScenario } from './detection/evaluate';
import { figures, formatReport } from './detection/report';
import { buildScenarios, FULL_COUNTS, type ScenarioCounts } from './detection/scenarios';

const DEFAULT_SEED = 20250401;

function countsFor(scale: number): ScenarioCounts {
  const scaled = (n: number) => Math.max(1, Math.round(n * scale));
  return {
    healthy: scaled(FULL_COUNTS.healthy),
    perApplianceFault: scaled(FULL_COUNTS.perApplianceFault),
    perSensorFault: scaled(FULL_COUNTS.perSensorFault),
    properties: scaled(FULL_COUNTS.properties),
    unitsPerProperty: FULL_COUNTS.unitsPerProperty,
  };
}

function main(): void {
  const seed = Number(process.env.BENCH_SEED ?? DEFAULT_SEED);
  const scale = Number(process.env.BENCH_SCALE ?? 1);
  const startedMs = Date.now();
  const scenarios = buildScenarios(seed, countsFor(scale));
  const outcomes = scenarios.map(evaluateScenario);
  const readings = outcomes.reduce((sum, o) => sum + o.readings, 0);
  const report = formatReport(figures(outcomes, 'engine'), figures(outcomes, 'thermometer'));
  const seconds = ((Date.now() - startedMs) / 1000).toFixed(1);
  console.log(`Detection benchmark: seed ${seed}, ${scenarios.length} traces, ${readings} readings, ${seconds} s\n`);
  console.log(report);
  if (process.env.BENCH_DETAIL) {
    for (const o of outcomes.filter((x) => x.scenario.group !== 'healthy' || x.engine.falseRepair > 0)) {
      const first = o.engine.first;
      const h = first && o.scenario.onsetMs ? ((first.detectedAtMs - o.scenario.onsetMs) / 3_600_000).toFixed(1) : '-';
      console.log([o.scenario.id, o.scenario.style, `${o.scenario.intervalMs / 60000}min`, o.visible ? 'visible' : 'hidden', `det ${h}h`, first?.topCauseAtOpen, first?.topCauseFinal, `false ${o.engine.falseRepair}`, o.engine.sensorFaultFound ? 'sensor' : ''].join(' '));
    }
  }
}

main();
