/**
 * Shapes shared by the detection engine, its callers (live ingest, logger-file analysis,
 * the web upload) and the tests. Everything here is plain data so it serialises to JSON.
 */
import type { CauseCode, Compartment, FindingKind, Probe, Severity } from '../../shared/domain';

/** One reading as the engine sees it: temperatures in °C, null for a missing probe value. */
export interface EngineReading {
  atMs: number;
  freshFoodC: number | null;
  freezerC: number | null;
  /** Door switch, when the sensor has one. Logger files usually do not. */
  doorOpen?: boolean;
}

export interface ProbableCause {
  code: CauseCode;
  /** 0..1; the confidences of one finding sum to at most 1. */
  confidence: number;
}

export interface Finding {
  /** Stable within one engine: kind, compartment and the start time. */
  id: string;
  kind: FindingKind;
  compartment: Compartment;
  /** Best estimate of when the trouble began (may lie before detection). */
  startedAtMs: number;
  /** Timestamp of the reading at which the engine concluded it (causal). */
  detectedAtMs: number;
  endedAtMs: number | null;
  severity: Severity;
  probableCauses: ProbableCause[];
  /** Minutes the fresh-food section spent above 40 °F (4.4 °C) since the finding started. */
  minutesAbove4c: number;
  /** Forecast of when the compartment crosses its food-safety limit, for a warming trend. */
  forecastCrossingAtMs?: number | null;
  summary: string;
}

export type EngineEventType = 'opened' | 'updated' | 'closed';
export interface EngineEvent {
  type: EngineEventType;
  /** Time of the reading that produced the event. */
  atMs: number;
  finding: Finding;
}

/** Kinds that would send a technician; a sensor fault never does by itself. */
export const REPAIR_KINDS: readonly FindingKind[] = ['over-temperature', 'warming-trend', 'no-cooling'];

export function isRepairFinding(finding: Pick<Finding, 'kind'>): boolean {
  return REPAIR_KINDS.includes(finding.kind);
}

/** One probe's smoothed level as the engine sees it now, with its learned normal. */
export interface ProbeLevelNow {
  /** Median of the recent quarter-hour means (°C), null before there are enough. */
  levelC: number | null;
  /** End of the quarter-hour bucket the level was last computed at. */
  levelAtMs: number | null;
  baselineC: number | null;
}

/** What the engine has learned about one appliance's own normal rhythm. */
export interface LearnedNormal {
  /** True once the learning period is over and deviations are judged against the baseline. */
  ready: boolean;
  baselineC: Record<Probe, number | null>;
  /** Robust spread of the smoothed level around the baseline (°C). */
  spreadC: Record<Probe, number | null>;
  cyclePeriodMinutes: number | null;
  defrostIntervalHours: number | null;
  defrostRiseC: number | null;
  defrostDurationMinutes: number | null;
  doorOpeningsPerDay: number | null;
  /** Door openings per hour of day (UTC), counted over the whole history. */
  doorOpeningsByHourUtc: number[];
}
