/**
 * The appliance's normal rhythm, learned from every valid reading: the compressor cycle
 * (crossings of a running mean with hysteresis), the automatic defrost (brief freezer rises
 * without a door opening, 20–45 minutes by common practice), and the door pattern.
 */
import type { DetectionSettings } from './settings';
import { pushRing, type DefrostEvent, type EngineState, type ProbeRhythm } from './state';
import { lambdaForGap } from './stats/ewma';
import { median } from './stats/robust';

const MINUTE_MS = 60_000;
// Bound once: tsx/esbuild would otherwise call a module getter for every reading.
const hot = { lambdaForGap, pushRing };
const HOUR_MS = 60 * MINUTE_MS;
const PERIOD_RING = 16;
const DEFROST_RING = 16;
const RECENT_RISES = 3;
const MIN_CYCLE_MIN = 8;
const MAX_CYCLE_MIN = 600;
/** A defrost keeps the air up for 20 minutes or more; the air recovers from a door opening faster. */
const DEFROST_MIN_MINUTES = 20;

// Readings mostly come at one interval: the weight for the last gap is kept, not recomputed.
let lastGapMs = -1;
let lastTimeConstantMs = -1;
let lastWeight = 0;

function smoothingWeight(gapMs: number, timeConstantMs: number): number {
  if (gapMs !== lastGapMs || timeConstantMs !== lastTimeConstantMs) {
    lastGapMs = gapMs;
    lastTimeConstantMs = timeConstantMs;
    lastWeight = hot.lambdaForGap(gapMs, timeConstantMs);
  }
  return lastWeight;
}

/** Tracks crossings of the running mean; returns nothing, updates the ring of periods. */
export function trackCycle(r: ProbeRhythm, valueC: number, atMs: number, gapMs: number, settings: DetectionSettings): void {
  if (r.smoothC === null) {
    r.smoothC = valueC;
    return;
  }
  r.smoothC += smoothingWeight(gapMs, settings.cycleSmoothingMinutes * MINUTE_MS) * (valueC - r.smoothC);
  const deviationC = valueC - r.smoothC;
  if (r.side > 0 && deviationC > r.halfCyclePeakC) r.halfCyclePeakC = deviationC;
  if (r.side <= 0 && deviationC > settings.cycleHysteresisC) {
    if (r.side < 0 && r.lastUpCrossingMs !== null) {
      const periodMin = (atMs - r.lastUpCrossingMs) / MINUTE_MS;
      if (periodMin >= MIN_CYCLE_MIN && periodMin <= MAX_CYCLE_MIN) pushRing(r.periodsMin, periodMin, PERIOD_RING);
    }
    r.side = 1;
    r.lastUpCrossingMs = atMs;
  } else if (r.side >= 0 && deviationC < -settings.cycleHysteresisC) {
    if (r.side > 0) noteCycleSwing(r);
    r.side = -1;
    r.halfCyclePeakC = 0;
  }
}

const SWING_WEIGHT = 0.1;

/** Typical height of a cycle's peak above the running mean (median-like: big peaks count little). */
function noteCycleSwing(r: ProbeRhythm): void {
  const peak = r.halfCyclePeakC;
  if (r.cycleSwingC === null) r.cycleSwingC = peak;
  else r.cycleSwingC += SWING_WEIGHT * Math.sign(peak - r.cycleSwingC) * Math.min(Math.abs(peak - r.cycleSwingC), 0.5);
}

/** A rise counts as an excursion only above the unit's own compressor swing. */
export function excursionThresholdC(r: ProbeRhythm, settings: DetectionSettings): number {
  return Math.max(settings.excursionRiseC, r.cycleSwingC !== null ? 1.5 * r.cycleSwingC + 0.5 : 0);
}

export function cyclePeriodMinutes(r: ProbeRhythm, intervalMin: number | null): number | null {
  if (r.periodsMin.length < 4) return null;
  const period = median(r.periodsMin);
  // A cycle sampled fewer than four times per period cannot be told from aliasing.
  if (intervalMin !== null && period < 4 * intervalMin) return null;
  return period;
}

/**
 * Watches a probe for brief rises above its level (a door opening, a defrost). On the
 * probe that carries the defrost (the freezer, or the fresh food of a fresh-food-only
 * unit) the rises without a door opening are recorded as defrosts.
 */
export function trackExcursion(
  state: EngineState,
  r: ProbeRhythm,
  valueC: number,
  referenceC: number | null,
  atMs: number,
  settings: DetectionSettings,
  recordsDefrost: boolean,
): void {
  const thresholdC = excursionThresholdC(r, settings);
  if (r.excursionStartMs === null) {
    if (referenceC === null || valueC <= referenceC + thresholdC) return;
    r.excursionStartMs = atMs;
    r.excursionReferenceC = referenceC;
    r.excursionPeakC = valueC - referenceC;
    r.excursionDoor = state.doorOpen;
    r.transientInBucket = true;
    return;
  }
  if (atMs - r.excursionStartMs <= transientLimitMinutes(state, settings) * MINUTE_MS) r.transientInBucket = true;
  r.excursionPeakC = Math.max(r.excursionPeakC, valueC - r.excursionReferenceC);
  r.excursionDoor ||= state.doorOpen;
  const durationMin = (atMs - r.excursionStartMs) / MINUTE_MS;
  if (durationMin > 4 * settings.defrostMaxMinutes) {
    r.excursionStartMs = null; // a long warm spell is not a defrost; the trend logic judges it
    return;
  }
  if (valueC >= r.excursionReferenceC + thresholdC / 2) return;
  // Every door-less rise of defrost length or longer tells how strong the defrost heater still is.
  if (recordsDefrost && !r.excursionDoor && durationMin >= DEFROST_MIN_MINUTES) noteRise(state, r.excursionPeakC, r.excursionStartMs);
  if (recordsDefrost && !r.excursionDoor && durationMin >= DEFROST_MIN_MINUTES && durationMin <= settings.defrostMaxMinutes) {
    recordDefrost(state, { atMs: r.excursionStartMs, riseC: r.excursionPeakC, durationMin }, settings);
  }
  r.excursionStartMs = null;
}

const SHRUNK_SHARE = 0.7;

function noteRise(state: EngineState, riseC: number, atMs: number): void {
  pushRing(state.recentRisesC, riseC, RECENT_RISES);
  const normal = state.normalDefrostRiseC;
  if (normal === null) return;
  if (riseC < SHRUNK_SHARE * normal) state.risesShrunkSinceMs ??= atMs;
  else state.risesShrunkSinceMs = null;
}

function recordDefrost(state: EngineState, event: DefrostEvent, settings: DetectionSettings): void {
  const last = state.defrosts[state.defrosts.length - 1];
  if (last && event.atMs - last.atMs < settings.defrostMinSpacingHours * HOUR_MS) {
    // Two rises close together are one defrost and its aftermath (or a door): keep the larger.
    if (event.riseC > last.riseC) state.defrosts[state.defrosts.length - 1] = { ...event, atMs: last.atMs };
    learnDefrostRhythm(state);
    return;
  }
  state.defrosts.push(event);
  if (state.defrosts.length > DEFROST_RING) state.defrosts.shift();
  learnDefrostRhythm(state);
}

/** Refits the rhythm once per recorded rise and keeps it in the state for the hot path. */
function learnDefrostRhythm(state: EngineState): void {
  const rhythm = defrostRhythm(state.defrosts);
  state.defrostRhythm = rhythm;
  state.defrostDurationMin = rhythm.durationMinutes;
  // The normal size of a defrost rise follows the rhythm while the unit is healthy (no repair
  // finding open, no rise already shrunk), so a dying heater cannot teach it a smaller normal.
  const healthy = !state.findings.some((f) => f.kind !== 'sensor-fault') && state.risesShrunkSinceMs === null;
  if (rhythm.riseC !== null && (state.normalDefrostRiseC === null || healthy)) state.normalDefrostRiseC = rhythm.riseC;
}

/** Longest excursion still treated as a brief transient: a little longer than the unit's own defrost. */
export function transientLimitMinutes(state: EngineState, settings: DetectionSettings): number {
  const learned = state.defrostDurationMin;
  if (learned === null) return settings.defrostMaxMinutes;
  return Math.min(settings.defrostMaxMinutes, Math.max(45, 1.5 * learned));
}

export interface DefrostRhythm {
  intervalHours: number | null;
  riseC: number | null;
  durationMinutes: number | null;
  lastAtMs: number | null;
}

/**
 * The defrost timer is strictly periodic while door openings and other rises are not: the
 * interval is the period T whose comb of slots best fits the recorded rises (hits minus slots
 * left empty), tried over every spacing between two rises.
 */
function isOnComb(atMs: number, anchorMs: number, periodMs: number, toleranceMs: number): boolean {
  const slots = (atMs - anchorMs) / periodMs;
  return Math.abs(slots - Math.round(slots)) * periodMs <= toleranceMs;
}

interface CombFit {
  anchor: number;
  hits: number;
  firstMs: number;
  lastMs: number;
}

const fit: CombFit = { anchor: -1, hits: 0, firstMs: 0, lastMs: 0 };

/**
 * Best anchor for the period (the first of the most hits), counted over plain times without
 * building arrays: this runs for every pair of rises each time a rise is recorded.
 */
function combFit(timesMs: Float64Array, periodMs: number): CombFit {
  const toleranceMs = Math.max(0.5 * HOUR_MS, 0.04 * periodMs);
  fit.anchor = -1;
  fit.hits = 0;
  for (let a = 0; a < timesMs.length; a++) {
    let hits = 0;
    let firstMs = 0;
    let lastMs = 0;
    for (let i = 0; i < timesMs.length; i++) {
      if (!isOnComb(timesMs[i], timesMs[a], periodMs, toleranceMs)) continue;
      if (hits === 0) firstMs = timesMs[i];
      lastMs = timesMs[i];
      hits++;
    }
    if (hits > fit.hits) {
      fit.anchor = a;
      fit.hits = hits;
      fit.firstMs = firstMs;
      fit.lastMs = lastMs;
    }
  }
  return fit;
}

function combHits(defrosts: readonly DefrostEvent[], anchor: number, periodMs: number): DefrostEvent[] {
  const toleranceMs = Math.max(0.5 * HOUR_MS, 0.04 * periodMs);
  return defrosts.filter((d) => isOnComb(d.atMs, defrosts[anchor].atMs, periodMs, toleranceMs));
}

const MIN_COMB_HITS = 3;
const MAX_PAIR_SPAN = 4;
const MAX_DEFROST_INTERVAL_MS = 96 * HOUR_MS;

/** Spacings closer than this fit the same comb: the timer is exact, the readings a minute apart. */
const SAME_PERIOD_MS = 60_000;

/** Candidate periods: spacings of rises at most a few apart, shortest first, near-repeats dropped. */
function candidatePeriods(timesMs: Float64Array): number[] {
  const periods: number[] = [];
  for (let i = 0; i < timesMs.length; i++) {
    // The period is the spacing of two rises with at most a few others (doors, a missed
    // defrost) between them; wider pairs only repeat multiples already tried.
    for (let j = i + 1; j < timesMs.length && j <= i + MAX_PAIR_SPAN; j++) {
      const periodMs = timesMs[j] - timesMs[i];
      if (periodMs >= 4 * HOUR_MS && periodMs <= MAX_DEFROST_INTERVAL_MS) periods.push(periodMs);
    }
  }
  periods.sort((a, b) => a - b);
  return periods.filter((p, k) => k === 0 || p - periods[k - 1] >= SAME_PERIOD_MS);
}

export function defrostRhythm(defrosts: readonly DefrostEvent[]): DefrostRhythm {
  const lastAtMs = defrosts.length ? defrosts[defrosts.length - 1].atMs : null;
  let bestScore = 0;
  let bestAnchor = -1;
  let bestPeriodMs = 0;
  const timesMs = Float64Array.from(defrosts, (d) => d.atMs);
  for (const periodMs of candidatePeriods(timesMs)) {
    const fit = combFit(timesMs, periodMs);
    const empty = Math.round((fit.lastMs - fit.firstMs) / periodMs) + 1 - fit.hits;
    const score = fit.hits - empty;
    // Shortest first: a longer period must score strictly better.
    if (fit.hits >= MIN_COMB_HITS && score > bestScore) {
      bestScore = score;
      bestAnchor = fit.anchor;
      bestPeriodMs = periodMs;
    }
  }
  if (bestAnchor < 0) return { intervalHours: null, riseC: null, durationMinutes: null, lastAtMs };
  const bestHits = combHits(defrosts, bestAnchor, bestPeriodMs);
  const steps: number[] = [];
  for (let i = 1; i < bestHits.length; i++) {
    const gap = bestHits[i].atMs - bestHits[i - 1].atMs;
    steps.push(gap / Math.max(1, Math.round(gap / bestPeriodMs)) / HOUR_MS);
  }
  return {
    intervalHours: median(steps),
    riseC: median(bestHits.map((d) => d.riseC)),
    durationMinutes: median(bestHits.map((d) => d.durationMin)),
    lastAtMs: bestHits[bestHits.length - 1].atMs,
  };
}

/** Counts door openings from the door switch (rising edges), by hour of day. */
export function trackDoor(state: EngineState, doorOpen: boolean | undefined, atMs: number): void {
  if (doorOpen === undefined) return;
  state.doorFlagsSeen = true;
  if (doorOpen && !state.doorOpen) {
    state.doorOpenings++;
    state.doorOpeningsByHourUtc[Math.floor(atMs / HOUR_MS) % 24]++;
  }
  state.doorOpen = doorOpen;
}

export function doorOpeningsPerDay(state: EngineState): number | null {
  if (!state.doorFlagsSeen || state.firstAtMs === null || state.lastAtMs === null) return null;
  const days = (state.lastAtMs - state.firstAtMs) / (24 * HOUR_MS);
  return days >= 1 ? state.doorOpenings / days : null;
}
