/**
 * warming-trend and no-cooling, judged once per bucket on the level series.
 *
 * warming-trend: the baseline-removed level, in units of the probe's learned spread, feeds
 * an upper tabular CUSUM (Montgomery, Introduction to SQC, §9.1); its run length dates the
 * onset. The CUSUM signal alone is not enough: the level must also sit at least
 * max(minimum rise, 4σ) above the baseline for the sustain period, and its Theil–Sen slope
 * must not show a recovery (a warm grocery load cools back down by itself).
 *
 * no-cooling: every compartment far above its normal and still climbing.
 */
import type { Probe } from '../../shared/domain';
import { closeFinding, findOpen, openFinding } from './finding-book';
import { isSuspectStuck, isTrusted, limitOf, minRiseOf, type EngineContext } from './context';
import { forecastCrossingMs, recentSlopeCPerHour, residualC, robustSlopeCPerHour } from './level';
import { currentCauses } from './signature';
import type { ProbeState } from './state';
import { cusumStep } from './stats/cusum';
import { noCoolingSummary, warmingSummary } from './summaries';

const MINUTE_MS = 60_000;

const CUSUM_CAP_FACTOR = 4;
const RECOVERY_WINDOW_MINUTES = 90;
const PEAK_SHARE = 0.9;

const SPREAD_MULTIPLE = 3;
const CORROBORATED_SHARE = 0.6;

/**
 * How far above its baseline a level must sit. A rhythm that changed along with it (the
 * compressor no longer cycling, readings turned spiky, defrost rises fading) corroborates a
 * smaller rise.
 */
function riseThresholdC(ctx: EngineContext, p: ProbeState): number {
  const threshold = Math.max(minRiseOf(p.probe, ctx.settings), SPREAD_MULTIPLE * (p.level.spreadC ?? 0));
  return isRhythmChanged(ctx, p) ? threshold * CORROBORATED_SHARE : threshold;
}

function isRhythmChanged(ctx: EngineContext, p: ProbeState): boolean {
  const { spikeC, normalSpikeC } = p.level;
  // Missing or coded readings thin the buckets out and fake a calmer or spikier probe.
  if (p.validation.faultReason !== null) return false;
  if (spikeC === null || normalSpikeC === null || normalSpikeC < ctx.settings.cycleHysteresisC) return false;
  const ratio = spikeC / normalSpikeC;
  return ratio < ctx.settings.continuousRunSpikeRatio || ratio > ctx.settings.spikyRatio;
}

function advanceCusum(ctx: EngineContext, p: ProbeState, residual: number, bucketEndMs: number): boolean {
  const { settings } = ctx;
  const t = p.trend;
  const sigma = p.level.spreadC as number;
  const signalled = cusumStep(t.cusum, residual / sigma, 0, settings.cusumReferenceSigma, settings.cusumDecisionSigma);
  t.cusum.sum = Math.min(t.cusum.sum, CUSUM_CAP_FACTOR * settings.cusumDecisionSigma);
  if (t.cusum.run === 1) t.cusumOnsetMs = bucketEndMs - (settings.levelWindowMinutes / 2) * MINUTE_MS;
  if (t.cusum.run === 0) t.cusumOnsetMs = null;
  return signalled;
}

const COLD_START_C = 1;

/** A compartment running colder than its normal is part of the signature (a damper, ice, a coil). */
function trackColdSpell(t: ProbeState['trend'], residual: number, threshold: number, bucketEndMs: number): void {
  if (residual > -COLD_START_C) {
    t.coolingFromMs = null;
    t.coldSinceMs = null;
    t.coolingHours = null;
    return;
  }
  t.coolingFromMs ??= bucketEndMs;
  if (residual <= -threshold && t.coldSinceMs === null) {
    t.coldSinceMs = bucketEndMs;
    t.coolingHours = (bucketEndMs - t.coolingFromMs) / (60 * MINUTE_MS);
  }
}

export function judgeWarming(ctx: EngineContext, p: ProbeState, bucketEndMs: number, atMs: number): void {
  const residual = residualC(p.level);
  if (residual === null || p.level.spreadC === null) return;
  const t = p.trend;
  const signalled = advanceCusum(ctx, p, residual, bucketEndMs);
  const threshold = riseThresholdC(ctx, p);
  if (residual >= threshold) t.risingSinceMs ??= bucketEndMs;
  else t.risingSinceMs = null;
  trackColdSpell(t, residual, threshold, bucketEndMs);
  t.peakResidualC = Math.max(t.peakResidualC, residual);
  if (findOpen(ctx.state, t.findingId)) {
    judgeWarmingRecovery(ctx, p, residual, bucketEndMs);
    return;
  }
  t.findingId = null;
  // A probe with an open sensor fault never starts a repair finding by itself.
  if (!signalled || t.risingSinceMs === null || p.validation.faultReason !== null || isSuspectStuck(p, atMs, ctx.settings)) return;
  if (bucketEndMs - t.risingSinceMs < ctx.settings.sustainMinutes * MINUTE_MS) return;
  // The raw quarter-hours, not the lagging level, show a warm load already being pulled down.
  const rawSlope = recentSlopeCPerHour(p.level, RECOVERY_WINDOW_MINUTES, atMs);
  if (rawSlope !== null && rawSlope <= ctx.settings.recoveringSlopeCPerHour) return;
  openWarming(ctx, p, robustSlopeCPerHour(p.level, ctx.settings.slopeWindowMinutes), atMs);
}

function openWarming(ctx: EngineContext, p: ProbeState, slope: number | null, atMs: number): void {
  const level = p.level;
  const crossing = forecastCrossingMs(level, limitOf(p.probe, ctx.settings), ctx.settings);
  const startedAtMs = p.trend.cusumOnsetMs ?? p.trend.risingSinceMs ?? atMs;
  const finding = openFinding(
    ctx.state,
    {
      kind: 'warming-trend',
      compartment: p.probe,
      startedAtMs: Math.min(startedAtMs, atMs),
      detectedAtMs: atMs,
      severity: warmingSeverity(ctx, p, crossing, atMs),
      probableCauses: currentCauses(ctx),
      summary: warmingSummary(p.probe, level.levelC as number, level.baselineC as number, slope, crossing),
      forecastCrossingAtMs: crossing,
    },
    ctx.events,
  );
  p.trend.findingId = finding.id;
  p.trend.recoveredSinceMs = null;
}

const URGENT_WITHIN_HOURS = 6;

export function warmingSeverity(ctx: EngineContext, p: ProbeState, crossingMs: number | null, atMs: number) {
  const levelC = p.level.levelC as number;
  if (levelC > limitOf(p.probe, ctx.settings)) return 'urgent' as const;
  if (crossingMs !== null && crossingMs - atMs < URGENT_WITHIN_HOURS * 60 * MINUTE_MS) return 'urgent' as const;
  return 'watch' as const;
}

function isRecovered(ctx: EngineContext, p: ProbeState, residual: number): boolean {
  const levelC = p.level.levelC as number;
  return residual <= ctx.settings.recoveredBandC && levelC <= limitOf(p.probe, ctx.settings);
}

function judgeWarmingRecovery(ctx: EngineContext, p: ProbeState, residual: number, bucketEndMs: number): void {
  const t = p.trend;
  if (!isRecovered(ctx, p, residual)) {
    t.recoveredSinceMs = null;
    return;
  }
  t.recoveredSinceMs ??= bucketEndMs;
  if (bucketEndMs - t.recoveredSinceMs < ctx.settings.recoveredHoldMinutes * MINUTE_MS) return;
  closeFinding(ctx.state, t.findingId, t.recoveredSinceMs, ctx.events);
  t.findingId = null;
  t.cusum.sum = 0;
  t.cusum.run = 0;
  t.peakResidualC = 0;
}

/** The running figures of an open warming-trend finding. */
export function warmingPatch(ctx: EngineContext, p: ProbeState, atMs: number) {
  const finding = findOpen(ctx.state, p.trend.findingId);
  if (!finding || p.level.levelC === null || p.level.baselineC === null) return null;
  const crossing = forecastCrossingMs(p.level, limitOf(p.probe, ctx.settings), ctx.settings);
  const slope = robustSlopeCPerHour(p.level, ctx.settings.slopeWindowMinutes);
  // The summary keeps describing the worst of the trend, not the recovery that closes it.
  const nearPeak = p.level.levelC - p.level.baselineC >= PEAK_SHARE * p.trend.peakResidualC;
  return {
    finding,
    patch: {
      severity: warmingSeverity(ctx, p, crossing, atMs),
      forecastCrossingAtMs: crossing,
      summary: nearPeak ? warmingSummary(p.probe, p.level.levelC, p.level.baselineC, slope, crossing) : undefined,
    },
  };
}

function noCoolingRiseC(ctx: EngineContext, probe: Probe): number {
  return probe === 'fresh_food' ? ctx.settings.noCoolingFreshRiseC : ctx.settings.noCoolingFreezerRiseC;
}

/** Heading for room temperature: far above normal and still climbing. */
function isHeadingToRoom(ctx: EngineContext, p: ProbeState): boolean {
  const residual = residualC(p.level);
  if (residual === null || !isTrusted(p) || isSuspectStuck(p, ctx.state.nowMs ?? 0, ctx.settings)) return false;
  if (residual < noCoolingRiseC(ctx, p.probe)) return false;
  const slope = robustSlopeCPerHour(p.level, ctx.settings.noCoolingSlopeWindowMinutes) ?? 0;
  return slope >= ctx.settings.noCoolingSlopeCPerHour;
}

function judgedProbes(ctx: EngineContext): ProbeState[] {
  return ctx.state.probes.filter((p) => p.level.baselineC !== null);
}

/** In a two-probe unit the fresh food follows the freezer later; it must have left its normal too. */
function isNoCooling(ctx: EngineContext): boolean {
  const probes = judgedProbes(ctx);
  if (probes.length === 0) return false;
  const freezer = probes.find((p) => p.probe === 'freezer');
  const fresh = probes.find((p) => p.probe === 'fresh_food');
  if (freezer && fresh) {
    const freshResidual = residualC(fresh.level) ?? 0;
    if (freshResidual < ctx.settings.freshMinRiseC || !isTrusted(fresh) || !isHeadingToRoom(ctx, freezer)) return false;
    return (robustSlopeCPerHour(fresh.level, ctx.settings.noCoolingSlopeWindowMinutes) ?? 0) > 0;
  }
  return probes.every((p) => isHeadingToRoom(ctx, p));
}

function earliestOnset(ctx: EngineContext, atMs: number): number {
  const onsets = ctx.state.probes.map((p) => p.trend.cusumOnsetMs).filter((t): t is number => t !== null);
  return onsets.length ? Math.min(atMs, ...onsets) : atMs;
}

function levelOf(ctx: EngineContext, probe: Probe): number | null {
  return ctx.state.probes.find((p) => p.probe === probe)?.level.levelC ?? null;
}

export function judgeNoCooling(ctx: EngineContext, bucketEndMs: number, atMs: number): void {
  const state = ctx.state;
  const open = findOpen(state, state.noCoolingFindingId);
  if (open) {
    judgeNoCoolingRecovery(ctx, bucketEndMs);
    return;
  }
  state.noCoolingFindingId = null;
  if (!state.ready || !isNoCooling(ctx)) return;
  state.noCoolingFindingId = 'pending'; // lets the diagnosis see the no-cooling verdict
  const finding = openFinding(
    state,
    {
      kind: 'no-cooling',
      compartment: judgedProbes(ctx).length > 1 ? 'both' : judgedProbes(ctx)[0].probe,
      startedAtMs: earliestOnset(ctx, atMs),
      detectedAtMs: atMs,
      severity: 'critical',
      probableCauses: currentCauses(ctx),
      summary: noCoolingSummary(levelOf(ctx, 'fresh_food'), levelOf(ctx, 'freezer')),
    },
    ctx.events,
  );
  state.noCoolingFindingId = finding.id;
  state.noCoolingRecoveredSinceMs = null;
}

function judgeNoCoolingRecovery(ctx: EngineContext, bucketEndMs: number): void {
  const state = ctx.state;
  const recovered = judgedProbes(ctx).every((p) => {
    const residual = residualC(p.level);
    return residual !== null && isRecovered(ctx, p, residual);
  });
  if (!recovered) {
    state.noCoolingRecoveredSinceMs = null;
    return;
  }
  state.noCoolingRecoveredSinceMs ??= bucketEndMs;
  if (bucketEndMs - state.noCoolingRecoveredSinceMs < ctx.settings.recoveredHoldMinutes * MINUTE_MS) return;
  closeFinding(state, state.noCoolingFindingId, state.noCoolingRecoveredSinceMs, ctx.events);
  state.noCoolingFindingId = null;
}

export function noCoolingPatch(ctx: EngineContext) {
  const finding = findOpen(ctx.state, ctx.state.noCoolingFindingId);
  if (!finding) return null;
  return { finding, patch: { summary: noCoolingSummary(levelOf(ctx, 'fresh_food'), levelOf(ctx, 'freezer')) } };
}

