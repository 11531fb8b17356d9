/**
 * How much of the time the compressor runs, estimated from the temperature alone: while it
 * runs, the air next to the evaporator gets colder; while it rests, the air warms. The share
 * of time the reading fell (readings compared at least `dutyStepMinutes` apart, so 1-minute
 * loggers and 15-minute ones see the same slope rather than sensor noise) follows the duty
 * cycle. Per bucket that share feeds an EWMA (NIST/SEMATECH e-Handbook §6.3.2.4) whose time
 * constant is `dutyTimeConstantHours`; its learned normal is the share over the learning day,
 * followed slowly afterwards like the level baseline.
 *
 * A part that fails without warming the cabinet (a starved condenser, a leaking door seal, an
 * iced coil) shows as this estimate climbing toward continuous running (common practice of
 * the repair trade: "it runs all the time").
 */
import type { DetectionSettings } from './settings';
import type { DutyState } from './state';

const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;
/** A gap longer than this breaks the comparison: the step is not a slope of one cycle any more. */
const MAX_STEP_MINUTES = 30;

export function newDutyState(): DutyState {
  return { refC: null, refAtMs: null, fallMs: 0, changeMs: 0, ewma: null, learnFallMs: 0, learnChangeMs: 0, baseline: null, aboveSinceMs: null };
}

/** Per valid reading of the probe next to the evaporator (hot path: no allocation). */
export function trackDuty(d: DutyState, valueC: number, atMs: number, settings: DetectionSettings): void {
  if (d.refAtMs === null || d.refC === null || atMs - d.refAtMs > MAX_STEP_MINUTES * MINUTE_MS) {
    d.refC = valueC;
    d.refAtMs = atMs;
    return;
  }
  const stepMs = atMs - d.refAtMs;
  if (stepMs < settings.dutyStepMinutes * MINUTE_MS - 1000) return;
  if (valueC < d.refC) d.fallMs += stepMs;
  if (valueC !== d.refC) d.changeMs += stepMs;
  d.refC = valueC;
  d.refAtMs = atMs;
}

/** Folds the bucket into the EWMA (and, while learning, into the learned normal). */
export function closeDutyBucket(d: DutyState, learning: boolean, settings: DetectionSettings): void {
  if (d.changeMs > 0) {
    const share = d.fallMs / d.changeMs;
    const weight = 1 - Math.exp(-d.changeMs / (settings.dutyTimeConstantHours * HOUR_MS));
    d.ewma = d.ewma === null ? share : d.ewma + weight * (share - d.ewma);
    if (learning) {
      d.learnFallMs += d.fallMs;
      d.learnChangeMs += d.changeMs;
    }
  }
  d.fallMs = 0;
  d.changeMs = 0;
}

export function finishDutyLearning(d: DutyState): void {
  if (d.baseline === null && d.learnChangeMs > 0) d.baseline = d.learnFallMs / d.learnChangeMs;
}

/** The estimate above its learned normal (share of time), null before both exist. */
export function dutyExcess(d: DutyState): number | null {
  return d.ewma === null || d.baseline === null ? null : d.ewma - d.baseline;
}

/** Follows a slow change of the normal (season, set point) while the estimate stays near it. */
export function adaptDutyBaseline(d: DutyState, settings: DetectionSettings): void {
  const excess = dutyExcess(d);
  if (excess === null || Math.abs(excess) > settings.dutyAdaptBand) return;
  d.baseline = (d.baseline as number) + ((settings.bucketMinutes * MINUTE_MS) / (settings.baselineAdaptHours * HOUR_MS)) * excess;
}
