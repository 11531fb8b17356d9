/** Reads the current temperature signature out of the engine state for the diagnosis. */
import type { Probe } from '../../shared/domain';
import { HOUR_MS, isTrusted, probeState, type EngineContext } from './context';
import { diagnose, type ProbeSignature, type Signature } from './diagnosis';
import { residualC, robustSlopeCPerHour } from './level';
import { defrostRhythm } from './rhythm';
import type { ProbableCause } from './types';

function probeSignature(ctx: EngineContext, probe: Probe): ProbeSignature | null {
  const p = probeState(ctx.state, probe);
  if (!p || !isTrusted(p) || p.level.levelC === null) return null;
  const rise = residualC(p.level);
  if (rise === null) return null;
  const nowMs = ctx.state.lastAtMs ?? 0;
  const onset = p.trend.cusumOnsetMs;
  const normalSpike = p.level.normalSpikeC;
  return {
    riseC: rise,
    slopeCPerHour: robustSlopeCPerHour(p.level, ctx.settings.slopeWindowMinutes),
    hoursRising: onset !== null ? (nowMs - onset) / HOUR_MS : null,
    spikeRatio: normalSpike !== null && p.level.spikeC !== null ? p.level.spikeC / Math.max(0.2, normalSpike) : null,
    levelC: p.level.levelC,
  };
}

/** How overdue the next defrost rise is, in learned intervals (null before a rhythm is known). */
function defrostOverdueRatio(ctx: EngineContext): number | null {
  const rhythm = defrostRhythm(ctx.state.defrosts);
  const nowMs = ctx.state.lastAtMs;
  if (rhythm.intervalHours === null || rhythm.lastAtMs === null || nowMs === null) return null;
  return (nowMs - rhythm.lastAtMs) / HOUR_MS / rhythm.intervalHours;
}

export function currentSignature(ctx: EngineContext): Signature {
  return {
    style: ctx.state.style,
    freshFood: probeSignature(ctx, 'fresh_food'),
    freezer: probeSignature(ctx, 'freezer'),
    defrostOverdueRatio: defrostOverdueRatio(ctx),
    noCooling: ctx.state.noCoolingFindingId !== null,
  };
}

export function currentCauses(ctx: EngineContext): ProbableCause[] {
  return diagnose(currentSignature(ctx));
}
