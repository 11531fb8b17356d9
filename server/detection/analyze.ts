/**
 * One-shot analysis of a whole history (a logger file, an upload, a test trace) with the
 * same engine live ingest uses. Returns every finding in its final state and a summary.
 */
import type { ApplianceStyle, FindingKind, Health, Probe } from '../../shared/domain';
import { probesOf } from '../../shared/domain';
import { DetectionEngine } from './engine';
import type { LoggerSeries } from './logger-csv';
import { DEFAULT_SETTINGS, type DetectionSettings } from './settings';
import type { EngineEvent, EngineReading, Finding, LearnedNormal } from './types';

export interface AnalysisSummary {
  style: ApplianceStyle;
  probes: Probe[];
  readings: number;
  firstAtMs: number | null;
  lastAtMs: number | null;
  medianIntervalMinutes: number | null;
  health: Health;
  learned: LearnedNormal;
  freshMinutesAbove4c: number;
  findingsByKind: Partial<Record<FindingKind, number>>;
}

export interface AnalysisResult {
  findings: Finding[];
  summary: AnalysisSummary;
}

class FindingCollector {
  private readonly byId = new Map<string, Finding>();

  take(events: readonly EngineEvent[]): void {
    for (const event of events) this.byId.set(event.finding.id, event.finding);
  }

  /** Final state of every finding: closed ones as closed, open ones as the engine holds them. */
  all(engine: DetectionEngine): Finding[] {
    for (const open of engine.openFindings()) this.byId.set(open.id, open);
    return [...this.byId.values()].sort((a, b) => a.detectedAtMs - b.detectedAtMs || a.id.localeCompare(b.id));
  }
}

const INTERVAL_SAMPLES = 20_000;

/** Median gap between readings, from an evenly spread sample of the gaps on long files. */
function medianInterval(atMs: ArrayLike<number>, count: number): number | null {
  if (count < 2) return null;
  const step = Math.max(1, Math.floor((count - 1) / INTERVAL_SAMPLES));
  const gaps = new Float64Array(Math.ceil((count - 1) / step));
  for (let i = 1, k = 0; i < count && k < gaps.length; i += step, k++) gaps[k] = atMs[i] - atMs[i - 1];
  gaps.sort();
  return gaps[gaps.length >> 1] / 60_000;
}

function summarise(engine: DetectionEngine, style: ApplianceStyle, probes: Probe[], findings: Finding[], times: ArrayLike<number>, count: number): AnalysisSummary {
  const findingsByKind: Partial<Record<FindingKind, number>> = {};
  for (const f of findings) findingsByKind[f.kind] = (findingsByKind[f.kind] ?? 0) + 1;
  return {
    style,
    probes,
    readings: count,
    firstAtMs: count ? times[0] : null,
    lastAtMs: count ? times[count - 1] : null,
    medianIntervalMinutes: medianInterval(times, count),
    health: engine.health(),
    learned: engine.learned(),
    freshMinutesAbove4c: engine.freshMinutesAboveLimit(),
    findingsByKind,
  };
}

/** Columnar path used by the CLI: one reusable reading object, no per-row allocation. */
export function analyzeSeries(series: LoggerSeries, style: ApplianceStyle, settings: DetectionSettings = { ...DEFAULT_SETTINGS }): AnalysisResult {
  const probes = probesOf(style).filter((p) => (p === 'fresh_food' ? series.hasFreshFood : series.hasFreezer));
  const engine = new DetectionEngine(style, settings, undefined, { probes: probes.length ? probes : probesOf(style) });
  const collector = new FindingCollector();
  const reading: EngineReading = { atMs: 0, freshFoodC: null, freezerC: null };
  const count = series.atMs.length;
  for (let i = 0; i < count; i++) {
    reading.atMs = series.atMs[i];
    const fresh = series.freshFoodC[i];
    const freezer = series.freezerC[i];
    reading.freshFoodC = fresh === fresh ? fresh : null; // NaN marks a blank cell
    reading.freezerC = freezer === freezer ? freezer : null;
    const events = engine.push(reading);
    if (events.length) collector.take(events);
  }
  const findings = collector.all(engine);
  return { findings, summary: summarise(engine, style, probes, findings, series.atMs, count) };
}

function sortedUnique(readings: readonly EngineReading[]): EngineReading[] {
  const sorted = [...readings].sort((a, b) => a.atMs - b.atMs);
  const unique: EngineReading[] = [];
  for (const r of sorted) {
    const last = unique[unique.length - 1];
    if (last && last.atMs === r.atMs) {
      unique[unique.length - 1] = { ...last, freshFoodC: last.freshFoodC ?? r.freshFoodC, freezerC: last.freezerC ?? r.freezerC };
    } else {
      unique.push(r);
    }
  }
  return unique;
}

/** Sorts and de-duplicates, then runs the engine over every reading. */
export function analyzeReadings(readings: readonly EngineReading[], style: ApplianceStyle, settings: DetectionSettings = { ...DEFAULT_SETTINGS }): AnalysisResult {
  const ordered = sortedUnique(readings);
  const engine = new DetectionEngine(style, settings);
  const collector = new FindingCollector();
  for (const r of ordered) {
    const events = engine.push(r);
    if (events.length) collector.take(events);
  }
  const findings = collector.all(engine);
  const times = ordered.map((r) => r.atMs);
  return { findings, summary: summarise(engine, style, [...probesOf(style)], findings, times, times.length) };
}
