/** Reads the current temperature signature out of the engine state for the diagnosis. */
import type { Probe } from '../../shared/domain';
import { HOUR_MS, isTrusted, probeState, type EngineContext } from './context';
import { causesFrom, rememberEvidence, scoreCauses, type ProbeSignature, type Signature } from './diagnosis';
import { recentRiseC, recentSlopeCPerHour, residualC, robustSlopeCPerHour } from './level';
import { transientLimitMinutes } from './rhythm';
import { dutyExcess } from './duty';
import { median } from './stats/robust';
import type { ProbeState } from './state';
import type { ProbableCause } from './types';

const RECENT_SLOPE_MINUTES = 120;

function hoursSince(fromMs: number | null, nowMs: number): number | null {
  return fromMs === null ? null : (nowMs - fromMs) / HOUR_MS;
}

function isYoungExcursion(ctx: EngineContext, p: ProbeState, nowMs: number): boolean {
  const startMs = p.rhythm.excursionStartMs;
  return startMs !== null && nowMs - startMs <= transientLimitMinutes(ctx.state, ctx.settings) * 60_000;
}

function probeSignature(ctx: EngineContext, probe: Probe): ProbeSignature | null {
  const p = probeState(ctx.state, probe);
  if (!p || !isTrusted(p) || p.level.levelC === null) return null;
  const levelRise = residualC(p.level);
  if (levelRise === null) return null;
  const nowMs = ctx.state.lastAtMs ?? 0;
  // While a brief excursion (a defrost, a door) is under way the raw shape says nothing yet.
  const young = isYoungExcursion(ctx, p, nowMs);
  const rise = young ? levelRise : (recentRiseC(p.level) ?? levelRise);
  const normalSpike = p.level.normalSpikeC;
  return {
    riseC: rise,
    levelRiseC: levelRise,
    slopeCPerHour: young ? robustSlopeCPerHour(p.level, RECENT_SLOPE_MINUTES) : recentSlopeCPerHour(p.level, RECENT_SLOPE_MINUTES, nowMs),
    hoursRising: hoursSince(p.trend.cusumOnsetMs, nowMs),
    hoursColder: hoursSince(p.trend.coldSinceMs, nowMs),
    coolingHours: p.trend.coolingHours,
    spikeRatio: normalSpike !== null && p.level.spikeC !== null ? p.level.spikeC / Math.max(0.2, normalSpike) : null,
    levelC: p.level.levelC,
  };
}

/** How overdue the next defrost rise is, in learned intervals (null before a rhythm is known). */
function defrostOverdueRatio(ctx: EngineContext): number | null {
  const rhythm = ctx.state.defrostRhythm;
  const nowMs = ctx.state.lastAtMs;
  if (rhythm.intervalHours === null || rhythm.lastAtMs === null || nowMs === null) return null;
  return (nowMs - rhythm.lastAtMs) / HOUR_MS / rhythm.intervalHours;
}

/**
 * The latest rises against the unit's normal defrost rise: a dead heater makes them shrink,
 * a working one keeps them (a stuck damper only makes them last longer).
 */
function lastDefrostRiseRatio(ctx: EngineContext): number | null {
  const { recentRisesC, normalDefrostRiseC } = ctx.state;
  if (normalDefrostRiseC === null || recentRisesC.length === 0) return null;
  return median(recentRisesC) / normalDefrostRiseC;
}

/** When the trouble began: the earliest rise or cold spell of any probe. */
function troubleStartMs(ctx: EngineContext): number | null {
  const starts = ctx.state.probes.flatMap((p) => [p.trend.cusumOnsetMs, p.trend.coolingFromMs]).filter((t): t is number => t !== null);
  return starts.length ? Math.min(...starts) : null;
}

/** Hours the defrost rises had been fading (shrunk, or overdue) before the trouble began. */
function defrostFadedHoursBefore(ctx: EngineContext): number | null {
  const state = ctx.state;
  const start = troubleStartMs(ctx) ?? state.lastAtMs;
  if (start === null) return null;
  const rhythm = state.defrostRhythm;
  const overdueFromMs = rhythm.lastAtMs !== null && rhythm.intervalHours !== null ? rhythm.lastAtMs + 1.5 * rhythm.intervalHours * HOUR_MS : null;
  const fadedFrom = [state.risesShrunkSinceMs, overdueFromMs].filter((t): t is number => t !== null);
  if (!fadedFrom.length) return null;
  return (start - Math.min(...fadedFrom)) / HOUR_MS;
}

export function currentSignature(ctx: EngineContext): Signature {
  return {
    style: ctx.state.style,
    freshFood: probeSignature(ctx, 'fresh_food'),
    freezer: probeSignature(ctx, 'freezer'),
    defrostOverdueRatio: defrostOverdueRatio(ctx),
    lastDefrostRiseRatio: lastDefrostRiseRatio(ctx),
    defrostFadedHoursBefore: defrostFadedHoursBefore(ctx),
    noCooling: ctx.state.noCoolingFindingId !== null,
    dutyExcess: dutyExcess(ctx.state.duty),
    runsOn: ctx.state.duty.aboveSinceMs !== null,
    coldDrift: ctx.state.rhythmChange.coldDriftSinceMs !== null,
  };
}

const EVIDENCE_FADE_PER_CALL = 0.998;

/** Causes for a repair finding: today's signature merged with the episode's remembered evidence. */
export function currentCauses(ctx: EngineContext): ProbableCause[] {
  const state = ctx.state;
  state.causeEvidence = rememberEvidence(state.causeEvidence, scoreCauses(currentSignature(ctx)), EVIDENCE_FADE_PER_CALL);
  return causesFrom(state.causeEvidence, state.style);
}

/** Forgets the episode's evidence once no repair finding is open. */
export function forgetEvidence(ctx: EngineContext): void {
  ctx.state.causeEvidence = {};
}
