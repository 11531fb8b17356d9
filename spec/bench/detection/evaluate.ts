/**
 * Runs one scenario through the simulator, the detection engine and the plain thermometer
 * alarm, and records what each concluded and when.
 */
import { DetectionEngine } from '../../../server/detection/engine';
import { isRepairFinding, type Finding } from '../../../server/detection/types';
import type { CauseCode, Probe } from '../../../shared/domain';
import { probesOf } from '../../../shared/domain';
import { FRESH_FOOD_LIMIT_C } from '../../../shared/temperature';
import { generateTrace, type SimSample } from '../../../simulator/model';
import { thermometerAlarms } from './thermometer';
import { HOUR_MS, type Scenario } from './scenarios';

export interface Detection {
  detectedAtMs: number;
  topCauseAtOpen: CauseCode | null;
  /** The most probable cause the work order shows when a technician arrives, 6 hours on. */
  topCauseAtVisit: CauseCode | null;
  topCauseFinal: CauseCode | null;
}

export const VISIT_AFTER_MS = 6 * HOUR_MS;

export interface DetectorOutcome {
  /** First repair finding (or alarm) at or after the onset. */
  first: Detection | null;
  /** Repair findings (or alarms) opened before the onset, or at all on a healthy trace. */
  falseRepair: number;
  sensorFaultFound: boolean;
}

export interface ScenarioOutcome {
  scenario: Scenario;
  /** Ground truth: the fault lifted a compartment's 3-hour median at least 2 °C above its day before. */
  visible: boolean;
  foodAtRiskAtMs: number | null;
  engine: DetectorOutcome;
  thermometer: DetectorOutcome;
  /** Every finding of the engine in its final state (for the property correlator). */
  findings: Finding[];
  readings: number;
}

const VISIBLE_RISE_C = 2;
const VISIBLE_WINDOW_MS = 3 * HOUR_MS;
const FOOD_AT_RISK_MINUTES = 120;
const SPELL_GAP_MS = 15 * 60_000;

function valueOf(sample: SimSample, probe: Probe): number | null {
  const value = probe === 'fresh_food' ? sample.freshFoodC : sample.freezerC;
  return value === null || value <= -100 || value >= 80 ? null : value;
}

function medianOf(values: number[]): number | null {
  if (!values.length) return null;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1];
}

/** Medians of consecutive 3-hour windows: long enough that a defrost or a door opening does not count. */
function windowMedians(trace: SimSample[], probe: Probe, fromMs: number): number[] {
  const byWindow = new Map<number, number[]>();
  for (const s of trace) {
    const v = valueOf(s, probe);
    if (s.atMs < fromMs || v === null) continue;
    const window = Math.floor((s.atMs - fromMs) / VISIBLE_WINDOW_MS);
    if (!byWindow.has(window)) byWindow.set(window, []);
    byWindow.get(window)!.push(v);
  }
  return [...byWindow.values()].map((vs) => medianOf(vs) as number);
}

function isVisible(scenario: Scenario, trace: SimSample[]): boolean {
  if (scenario.onsetMs === null) return false;
  const onset = scenario.onsetMs;
  return probesOf(scenario.style).some((probe) => {
    const before = medianOf(trace.filter((s) => s.atMs < onset && s.atMs >= onset - 24 * HOUR_MS).map((s) => valueOf(s, probe)).filter((v): v is number => v !== null));
    if (before === null) return false;
    return windowMedians(trace, probe, onset).some((m) => m >= before + VISIBLE_RISE_C);
  });
}

/**
 * When the food is at risk: the air of the compartment holding perishables has stayed above
 * 40 °F for 2 hours in one spell since the onset (USDA FSIS 2-hour rule). A spell ends once
 * the air has been back at or below the limit for 15 minutes, so door openings over days do
 * not add up.
 */
export function foodAtRiskAt(scenario: Scenario, trace: SimSample[]): number | null {
  if (scenario.onsetMs === null) return null;
  const probe: Probe = probesOf(scenario.style).includes('fresh_food') ? 'fresh_food' : 'freezer';
  let spellStartMs: number | null = null;
  let belowSinceMs: number | null = null;
  for (const s of trace) {
    const v = valueOf(s, probe);
    if (s.atMs < scenario.onsetMs || v === null) continue;
    if (v > FRESH_FOOD_LIMIT_C) {
      spellStartMs ??= s.atMs;
      belowSinceMs = null;
      if (s.atMs - spellStartMs >= FOOD_AT_RISK_MINUTES * 60_000) return s.atMs;
    } else {
      belowSinceMs ??= s.atMs;
      if (s.atMs - belowSinceMs >= SPELL_GAP_MS) spellStartMs = null;
    }
  }
  return null;
}

function runEngine(scenario: Scenario, trace: SimSample[]): { outcome: DetectorOutcome; findings: Finding[] } {
  const engine = new DetectionEngine(scenario.style);
  const onset = scenario.onsetMs ?? Infinity;
  const opened = new Map<string, { finding: Finding; topAtOpen: CauseCode | null }>();
  const final = new Map<string, Finding>();
  let firstAfterOnset: Finding | null = null;
  let latestCause: CauseCode | null = null;
  let causeAtVisit: CauseCode | null = null;
  for (const s of trace) {
    for (const event of engine.push({ atMs: s.atMs, freshFoodC: s.freshFoodC, freezerC: s.freezerC })) {
      final.set(event.finding.id, event.finding);
      if (event.type === 'opened') opened.set(event.finding.id, { finding: event.finding, topAtOpen: event.finding.probableCauses[0]?.code ?? null });
      if (!isRepairFinding(event.finding) || event.finding.detectedAtMs < onset) continue;
      if (event.type === 'opened' && firstAfterOnset === null) firstAfterOnset = event.finding;
      if (event.type !== 'closed') latestCause = event.finding.probableCauses[0]?.code ?? latestCause;
    }
    if (firstAfterOnset && causeAtVisit === null && s.atMs >= firstAfterOnset.detectedAtMs + VISIT_AFTER_MS) causeAtVisit = latestCause;
  }
  for (const f of engine.openFindings()) final.set(f.id, f);
  // A sensor that stops sending altogether is seen as silent, not as a finding.
  const silentAtEnd = engine.health(scenario.startMs + scenario.durationMs) === 'silent';
  const repairs = [...opened.values()].filter((o) => isRepairFinding(o.finding));
  const first = firstAfterOnset ? opened.get(firstAfterOnset.id)! : undefined;
  return {
    outcome: {
      first: first
        ? {
            detectedAtMs: first.finding.detectedAtMs,
            topCauseAtOpen: first.topAtOpen,
            topCauseAtVisit: causeAtVisit ?? latestCause,
            topCauseFinal: latestCause,
          }
        : null,
      falseRepair: repairs.filter((o) => o.finding.detectedAtMs < onset).length,
      sensorFaultFound: silentAtEnd || [...opened.values()].some((o) => o.finding.kind === 'sensor-fault' && o.finding.detectedAtMs >= onset),
    },
    findings: [...final.values()],
  };
}

function runThermometer(scenario: Scenario, trace: SimSample[]): DetectorOutcome {
  const alarms = thermometerAlarms(trace, probesOf(scenario.style));
  const onset = scenario.onsetMs ?? Infinity;
  const first = alarms.find((t) => t >= onset);
  return {
    first: first !== undefined ? { detectedAtMs: first, topCauseAtOpen: null, topCauseAtVisit: null, topCauseFinal: null } : null,
    falseRepair: alarms.filter((t) => t < onset).length,
    sensorFaultFound: false,
  };
}

export function evaluateScenario(scenario: Scenario): ScenarioOutcome {
  const trace = generateTrace({
    profile: scenario.profile,
    seed: scenario.seed,
    startMs: scenario.startMs,
    durationMs: scenario.durationMs,
    intervalMs: scenario.intervalMs,
    faults: scenario.faults,
    extraEvents: scenario.extraEvents,
  });
  const { outcome, findings } = runEngine(scenario, trace);
  return {
    scenario,
    visible: isVisible(scenario, trace),
    foodAtRiskAtMs: foodAtRiskAt(scenario, trace),
    engine: outcome,
    thermometer: runThermometer(scenario, trace),
    findings,
    readings: trace.length,
  };
}
