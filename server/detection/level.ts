/**
 * The level of one probe: valid readings are averaged per quarter-hour bucket, and the
 * level is the median of the last few bucket means, so a door opening or a defrost that
 * fills one or two buckets does not move it. The baseline is the appliance's own normal
 * level, learned over the first day and then followed slowly.
 */
import type { DetectionSettings } from './settings';
import { pushRing, type ProbeLevel } from './state';
import { mean } from 'simple-statistics';
import { median, medianOfWindow, robustSigma } from './stats/robust';
import { leastSquares, theilSenSlope } from './stats/regression';

const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;
const scratch: number[] = [];

export function bucketMs(settings: DetectionSettings): number {
  return settings.bucketMinutes * MINUTE_MS;
}

function levelWindowBuckets(settings: DetectionSettings): number {
  return Math.max(1, Math.round(settings.levelWindowMinutes / settings.bucketMinutes));
}

export function historyBuckets(settings: DetectionSettings): number {
  const longest = Math.max(settings.slopeWindowMinutes, settings.forecastWindowMinutes, settings.noCoolingSlopeWindowMinutes);
  return Math.ceil(longest / settings.bucketMinutes) + 1;
}

export function addToBucket(level: ProbeLevel, valueC: number): void {
  level.bucketSumC += valueC;
  level.bucketCount++;
  if (level.bucketMaxC === null || valueC > level.bucketMaxC) level.bucketMaxC = valueC;
}

/**
 * Closes the bucket: its mean joins the window and the level is recomputed.
 * Returns true when a new level exists. An empty bucket leaves a gap in the level series.
 */
export function closeBucket(level: ProbeLevel, bucketEndMs: number, settings: DetectionSettings, transient = false): boolean {
  const count = level.bucketCount;
  const meanC = count > 0 ? level.bucketSumC / count : NaN;
  const spikeC = count > 0 ? (level.bucketMaxC as number) - meanC : 0;
  level.bucketSumC = 0;
  level.bucketCount = 0;
  level.bucketMaxC = null;
  if (count === 0) return false;
  trackSpike(level, spikeC, settings);
  pushRing(level.recentMeansC, meanC, historyBuckets(settings));
  pushRing(level.recentTimesMs, bucketEndMs, historyBuckets(settings));
  if (transient) return false;
  pushRing(level.bucketMeansC, meanC, levelWindowBuckets(settings));
  if (level.bucketMeansC.length * 2 < levelWindowBuckets(settings)) return false;
  level.levelC = medianOfWindow(level.bucketMeansC, scratch);
  pushRing(level.levelsC, level.levelC, historyBuckets(settings));
  pushRing(level.levelTimesMs, bucketEndMs, historyBuckets(settings));
  return true;
}

/** Forgets the window after a long gap, so stale bucket means do not mix with new ones. */
export function resetWindow(level: ProbeLevel): void {
  level.bucketMeansC.length = 0;
  level.levelsC.length = 0;
  level.levelTimesMs.length = 0;
  level.levelC = null;
}

const LEARN_CAPACITY = 2000;
const SPIKE_TIME_CONSTANT_HOURS = 6;

/** Running mean of how far readings rise above their bucket mean (doors, leaks, defrost). */
function trackSpike(level: ProbeLevel, spikeC: number, settings: DetectionSettings): void {
  const weight = settings.bucketMinutes / (SPIKE_TIME_CONSTANT_HOURS * 60);
  level.spikeC = level.spikeC === null ? spikeC : level.spikeC + weight * (spikeC - level.spikeC);
  if (level.baselineC === null) pushRing(level.learnSpikesC, spikeC, LEARN_CAPACITY);
}

export function learnLevel(level: ProbeLevel): void {
  if (level.levelC !== null) pushRing(level.learnLevelsC, level.levelC, LEARN_CAPACITY);
}

/** Ends the learning period for this probe: baseline = median level, spread = robust σ. */
export function finishLearning(level: ProbeLevel, minSpreadC: number): boolean {
  if (level.learnLevelsC.length < 4) return false;
  level.baselineC = median(level.learnLevelsC);
  level.spreadC = Math.max(minSpreadC, robustSigma(level.learnLevelsC));
  level.learnLevelsC = [];
  level.normalSpikeC = level.learnSpikesC.length ? mean(level.learnSpikesC) : null;
  level.learnSpikesC = [];
  return true;
}

/** Follows a slow change of the unit's normal (a new set-point), never a failure. */
export function adaptBaseline(level: ProbeLevel, settings: DetectionSettings): void {
  if (level.baselineC === null || level.levelC === null) return;
  const residualC = level.levelC - level.baselineC;
  if (Math.abs(residualC) > settings.baselineAdaptBandC) return;
  const weight = (settings.bucketMinutes * MINUTE_MS) / (settings.baselineAdaptHours * HOUR_MS);
  level.baselineC += weight * residualC;
}

export function residualC(level: ProbeLevel): number | null {
  if (level.baselineC === null || level.levelC === null) return null;
  return level.levelC - level.baselineC;
}

/** Index of the first time inside the window ending at the latest time. */
function windowStart(timesMs: number[], windowMinutes: number): number {
  const last = timesMs.length - 1;
  const fromMs = timesMs[last] - windowMinutes * MINUTE_MS;
  let start = last;
  while (start > 0 && timesMs[start - 1] >= fromMs) start--;
  return start;
}

/** Robust slope of the level over the window, °C per hour; null with too few points. */
export function robustSlopeCPerHour(level: ProbeLevel, windowMinutes: number): number | null {
  return seriesSlopeCPerHour(level.levelTimesMs, level.levelsC, windowMinutes);
}

const recentTimes: number[] = [];
const recentValues: number[] = [];

/** Mean of the readings of the bucket still open, or null if it has none yet. */
function openBucketMeanC(level: ProbeLevel): number | null {
  return level.bucketCount > 0 ? level.bucketSumC / level.bucketCount : null;
}

/**
 * Slope over every recent bucket mean, transients included, plus the bucket still open
 * (placed at `nowMs`): the diagnosis sees the raw shape as of this reading.
 */
export function recentSlopeCPerHour(level: ProbeLevel, windowMinutes: number, nowMs: number): number | null {
  recentTimes.length = 0;
  recentValues.length = 0;
  for (let i = 0; i < level.recentTimesMs.length; i++) {
    recentTimes.push(level.recentTimesMs[i]);
    recentValues.push(level.recentMeansC[i]);
  }
  const open = openBucketMeanC(level);
  if (open !== null && nowMs > (recentTimes[recentTimes.length - 1] ?? -Infinity)) {
    recentTimes.push(nowMs);
    recentValues.push(open);
  }
  return seriesSlopeCPerHour(recentTimes, recentValues, windowMinutes);
}

/** The latest readings (the open bucket, or else the last closed one) minus the baseline. */
export function recentRiseC(level: ProbeLevel): number | null {
  if (level.baselineC === null) return null;
  const open = openBucketMeanC(level);
  if (open !== null) return open - level.baselineC;
  if (level.recentMeansC.length === 0) return null;
  return level.recentMeansC[level.recentMeansC.length - 1] - level.baselineC;
}

function seriesSlopeCPerHour(timesMs: number[], valuesC: number[], windowMinutes: number): number | null {
  if (timesMs.length < 3) return null;
  const start = windowStart(timesMs, windowMinutes);
  const count = timesMs.length - start;
  if (count < 3) return null;
  const perMs = theilSenSlope(timesMs, valuesC, start, count);
  return perMs === null ? null : perMs * HOUR_MS;
}

/** When the least-squares line through the recent levels reaches `limitC`, or null. */
export function forecastCrossingMs(level: ProbeLevel, limitC: number, settings: DetectionSettings): number | null {
  if (level.levelTimesMs.length < 3 || level.levelC === null || level.levelC >= limitC) return null;
  const start = windowStart(level.levelTimesMs, settings.forecastWindowMinutes);
  const lastMs = level.levelTimesMs[level.levelTimesMs.length - 1];
  const hours = level.levelTimesMs.slice(start).map((t) => (t - lastMs) / HOUR_MS);
  const fit = leastSquares(hours, level.levelsC.slice(start));
  if (fit === null || fit.slope <= 0) return null;
  const hoursAhead = (limitC - fit.intercept) / fit.slope;
  if (hoursAhead > settings.forecastHorizonHours) return null;
  return lastMs + Math.max(0, hoursAhead) * HOUR_MS;
}
