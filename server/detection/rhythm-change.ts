/**
 * A departure from the appliance's own rhythm that does not (yet) warm the cabinet, judged
 * once per bucket:
 * - the compressor duty estimate (duty.ts) has stayed `dutyExcessLimit` above its learned
 *   normal for `dutySustainHours`: the unit runs toward continuous running;
 * - the freezer level has stayed `coldDriftC` below its normal for `coldDriftSustainMinutes`
 *   while the unit has a fresh-food section: cold air no longer reaches the fresh food (a
 *   damper stuck closed, a duct iced over), so the compressor runs on for it.
 * The design brief's finding kinds have none for "runs too much", so this is reported as a
 * `warming-trend` of severity `watch` whose summary says what changed: it is the early stage
 * of trouble the brief asks to catch before food is at risk.
 */
import type { Compartment } from '../../shared/domain';
import { isSuspectStuck, probeState, type EngineContext } from './context';
import { adaptDutyBaseline, dutyExcess } from './duty';
import { closeFinding, findOpen, openFinding } from './finding-book';
import { residualC } from './level';
import { currentCauses } from './signature';
import type { ProbeState } from './state';
import { hasOpenRepair, defrostProbe } from './context';

const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;

function isQuiet(p: ProbeState | undefined): boolean {
  return p !== undefined && p.validation.faultReason === null;
}

/**
 * A unit running on holds a steady temperature, so at long intervals its probe may repeat a
 * value for half an hour: a probe that may be stuck pauses the judgement (it opens nothing)
 * rather than restarting the sustain period; a probe called faulty restarts it.
 */
function trackDutyExcess(ctx: EngineContext, bucketEndMs: number): boolean {
  const d = ctx.state.duty;
  const excess = dutyExcess(d);
  const carrier = defrostProbe(ctx.state);
  if (excess === null || excess < ctx.settings.dutyExcessLimit || !isQuiet(carrier)) {
    d.aboveSinceMs = null;
    return false;
  }
  d.aboveSinceMs ??= bucketEndMs;
  if (isSuspectStuck(carrier as ProbeState, ctx.state.nowMs ?? 0, ctx.settings)) return false;
  return bucketEndMs - d.aboveSinceMs >= ctx.settings.dutySustainHours * HOUR_MS;
}

function trackColdDrift(ctx: EngineContext, bucketEndMs: number): boolean {
  const r = ctx.state.rhythmChange;
  const freezer = probeState(ctx.state, 'freezer');
  const residual = freezer ? residualC(freezer.level) : null;
  const hasFresh = probeState(ctx.state, 'fresh_food') !== undefined;
  if (!hasFresh || residual === null || residual > -ctx.settings.coldDriftC || !isQuiet(freezer)) {
    r.coldDriftSinceMs = null;
    return false;
  }
  r.coldDriftSinceMs ??= bucketEndMs;
  if (isSuspectStuck(freezer as ProbeState, ctx.state.nowMs ?? 0, ctx.settings)) return false;
  return bucketEndMs - r.coldDriftSinceMs >= ctx.settings.coldDriftSustainMinutes * MINUTE_MS;
}

function percent(share: number): string {
  return `${Math.round(Math.min(1, Math.max(0, share)) * 100)} %`;
}

function summaryOf(ctx: EngineContext, runsOn: boolean, coldDrift: boolean): string {
  const parts: string[] = [];
  const d = ctx.state.duty;
  if (runsOn && d.ewma !== null && d.baseline !== null) {
    parts.push(`the compressor seems to run about ${percent(d.ewma)} of the time against its usual ${percent(d.baseline)}`);
  }
  const freezer = probeState(ctx.state, 'freezer');
  const residual = freezer ? residualC(freezer.level) : null;
  if (coldDrift && residual !== null) parts.push(`the freezer runs ${Math.abs(residual).toFixed(1)} °C colder than its own normal`);
  const what = parts.join(' and ');
  return `Rhythm changed: ${what}. The cabinet still holds its temperature but works much harder than before; a part is failing.`;
}

function compartmentOf(ctx: EngineContext, coldDrift: boolean): Compartment {
  if (coldDrift) return 'both';
  const carrier = defrostProbe(ctx.state);
  return ctx.state.probes.length > 1 ? 'both' : (carrier?.probe ?? 'both');
}

function open(ctx: EngineContext, runsOn: boolean, coldDrift: boolean, atMs: number): void {
  const r = ctx.state.rhythmChange;
  const starts = [runsOn ? ctx.state.duty.aboveSinceMs : null, coldDrift ? r.coldDriftSinceMs : null].filter((t): t is number => t !== null);
  const finding = openFinding(
    ctx.state,
    {
      kind: 'warming-trend',
      compartment: compartmentOf(ctx, coldDrift),
      startedAtMs: Math.min(atMs, ...starts),
      detectedAtMs: atMs,
      severity: 'watch',
      probableCauses: currentCauses(ctx),
      summary: summaryOf(ctx, runsOn, coldDrift),
    },
    ctx.events,
  );
  r.findingId = finding.id;
  r.recoveredSinceMs = null;
}

function judgeRecovery(ctx: EngineContext, runsOn: boolean, coldDrift: boolean, bucketEndMs: number): void {
  const r = ctx.state.rhythmChange;
  const excess = dutyExcess(ctx.state.duty) ?? 0;
  const freezer = probeState(ctx.state, 'freezer');
  const residual = freezer ? (residualC(freezer.level) ?? 0) : 0;
  // Back near normal on both counts (half the limits: hysteresis).
  const recovered = !runsOn && !coldDrift && excess < ctx.settings.dutyExcessLimit / 2 && residual > -ctx.settings.coldDriftC / 2;
  if (!recovered) {
    r.recoveredSinceMs = null;
    return;
  }
  r.recoveredSinceMs ??= bucketEndMs;
  if (bucketEndMs - r.recoveredSinceMs < ctx.settings.recoveredHoldMinutes * MINUTE_MS) return;
  closeFinding(ctx.state, r.findingId, r.recoveredSinceMs, ctx.events);
  r.findingId = null;
}

export function judgeRhythmChange(ctx: EngineContext, bucketEndMs: number, atMs: number): void {
  const r = ctx.state.rhythmChange;
  const runsOn = trackDutyExcess(ctx, bucketEndMs);
  const coldDrift = trackColdDrift(ctx, bucketEndMs);
  if (findOpen(ctx.state, r.findingId)) {
    judgeRecovery(ctx, runsOn, coldDrift, bucketEndMs);
    return;
  }
  r.findingId = null;
  // Another repair finding already tells of the trouble.
  const repairOpen = hasOpenRepair(ctx.state);
  if (!repairOpen) adaptDutyBaseline(ctx.state.duty, ctx.settings);
  if ((runsOn || coldDrift) && !repairOpen) open(ctx, runsOn, coldDrift, atMs);
}

/** The summary of an open rhythm-change finding follows the figures. */
export function rhythmChangePatch(ctx: EngineContext) {
  const finding = findOpen(ctx.state, ctx.state.rhythmChange.findingId);
  if (!finding) return null;
  const runsOn = ctx.state.duty.aboveSinceMs !== null;
  const coldDrift = ctx.state.rhythmChange.coldDriftSinceMs !== null;
  return runsOn || coldDrift ? { finding, patch: { summary: summaryOf(ctx, runsOn, coldDrift) } } : null;
}
