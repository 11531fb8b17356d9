/**
 * Small helpers for the detection specs: simulated traces (short, 5-minute intervals) and
 * hand-built signals, and a runner that keeps every event.
 */
import { DetectionEngine } from '../../../server/detection/engine';
import { isRepairFinding, type EngineEvent, type EngineReading, type Finding, type ProbableCause } from '../../../server/detection/types';
import type { ApplianceStyle, CauseCode } from '../../../shared/domain';
import { defaultProfile, generateTrace, type ApplianceProfile, type ExtraEvent, type FaultCode, type ScheduledFault } from '../../../simulator/model';

export const MINUTE_MS = 60_000;
export const HOUR_MS = 60 * MINUTE_MS;
export const DAY_MS = 24 * HOUR_MS;
export const START_MS = Date.UTC(2025, 2, 3);

export interface SimOptions {
  style: ApplianceStyle;
  days: number;
  fault?: FaultCode;
  onsetHours?: number;
  endHours?: number;
  probe?: ScheduledFault['probe'];
  severity?: number;
  seed?: number;
  intervalMinutes?: number;
  profile?: Partial<ApplianceProfile>;
  extraEvents?: ExtraEvent[];
}

export function simulate(o: SimOptions): EngineReading[] {
  const onsetMs = START_MS + (o.onsetHours ?? 30) * HOUR_MS;
  const faults: ScheduledFault[] = o.fault
    ? [{ fault: o.fault, startMs: onsetMs, endMs: o.endHours === undefined ? null : START_MS + o.endHours * HOUR_MS, severity: o.severity, probe: o.probe }]
    : [];
  const trace = generateTrace({
    profile: { ...defaultProfile(o.style), ...o.profile },
    seed: o.seed ?? 5,
    startMs: START_MS,
    durationMs: o.days * DAY_MS,
    intervalMs: (o.intervalMinutes ?? 5) * MINUTE_MS,
    faults,
    extraEvents: o.extraEvents,
  });
  return trace.map((s) => ({ atMs: s.atMs, freshFoodC: s.freshFoodC, freezerC: s.freezerC }));
}

export interface Run {
  engine: DetectionEngine;
  events: EngineEvent[];
  /** Final state of every finding. */
  findings: Finding[];
}

export function run(readings: readonly EngineReading[], style: ApplianceStyle, engine = new DetectionEngine(style)): Run {
  const events: EngineEvent[] = [];
  for (const r of readings) events.push(...engine.push(r));
  const byId = new Map<string, Finding>();
  for (const e of events) byId.set(e.finding.id, e.finding);
  for (const f of engine.openFindings()) byId.set(f.id, f);
  return { engine, events, findings: [...byId.values()] };
}

export function repairFindings(r: Run): Finding[] {
  return r.findings.filter(isRepairFinding);
}

export function firstRepair(r: Run): Finding | undefined {
  return repairFindings(r).sort((a, b) => a.detectedAtMs - b.detectedAtMs)[0];
}

/** The causes the latest repair-finding event showed `afterMs` after the first detection (the technician's visit). */
export function causesAtVisit(r: Run, afterMs = 6 * HOUR_MS): ProbableCause[] {
  const first = firstRepair(r);
  if (!first) return [];
  let causes = first.probableCauses;
  for (const e of r.events) {
    if (!isRepairFinding(e.finding) || e.type === 'closed') continue;
    if (e.atMs > first.detectedAtMs + afterMs) break;
    causes = e.finding.probableCauses;
  }
  return causes;
}

export function topCause(causes: readonly ProbableCause[]): CauseCode | undefined {
  return causes[0]?.code;
}

export interface SignalOptions {
  hours: number;
  intervalMinutes?: number;
  freshC?: number | null;
  freezerC?: number | null;
  cycleMinutes?: number;
  freshSwingC?: number;
  freezerSwingC?: number;
  /** Extra °C added to each probe at a time (a hand-made fault or excursion). */
  add?: (atMs: number) => { fresh?: number; freezer?: number };
  startMs?: number;
}

/** A clean compressor cycle (a triangle wave) around fixed levels, with optional additions. */
export function signal(o: SignalOptions): EngineReading[] {
  const readings: EngineReading[] = [];
  const interval = (o.intervalMinutes ?? 5) * MINUTE_MS;
  const start = o.startMs ?? START_MS;
  const cycle = (o.cycleMinutes ?? 40) * MINUTE_MS;
  for (let t = start; t < start + o.hours * HOUR_MS; t += interval) {
    const phase = ((t - start) % cycle) / cycle;
    const wave = phase < 0.5 ? 4 * phase - 1 : 3 - 4 * phase;
    const extra = o.add?.(t) ?? {};
    const fresh = o.freshC === null ? null : (o.freshC ?? 3) + wave * (o.freshSwingC ?? 0.5) + (extra.fresh ?? 0);
    const freezer = o.freezerC === null ? null : (o.freezerC ?? -19) + wave * (o.freezerSwingC ?? 1) + (extra.freezer ?? 0);
    readings.push({ atMs: t, freshFoodC: fresh === null ? null : round(fresh), freezerC: freezer === null ? null : round(freezer) });
  }
  return readings;
}

function round(value: number): number {
  return Math.round(value * 1000) / 1000;
}
