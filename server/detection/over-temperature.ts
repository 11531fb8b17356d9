/**
 * over-temperature: a compartment above its food-safety limit (FDA 40 °F / 0 °F) for longer
 * than a grace period that a door opening or a defrost does not reach. Judged on every valid
 * reading so the alarm is as early as the grace period allows.
 */
import { closeFinding, findOpen, openFinding } from './finding-book';
import { alarmLimitOf, isSuspectStuck, isTrusted, limitOf, type EngineContext } from './context';
import { currentCauses } from './signature';
import type { Severity } from '../../shared/domain';
import type { ProbeState } from './state';
import { overTempSummary } from './summaries';

const MINUTE_MS = 60_000;

// Bound once: tsx/esbuild would otherwise call a module getter for every reading.
const hot = { alarmLimitOf, limitOf, isTrusted, isSuspectStuck, findOpen };

function graceMinutes(ctx: EngineContext, p: ProbeState): number {
  const { settings, state } = ctx;
  if (p.probe === 'fresh_food') return settings.freshOverTempGraceMinutes;
  // A unit whose own defrost runs long gets a grace period beyond it.
  const learned = state.defrostDurationMin;
  return Math.max(settings.freezerOverTempGraceMinutes, learned !== null ? 2 * learned : 0);
}

function severityFor(p: ProbeState, valueC: number, minutesAbove4c: number, ctx: EngineContext): Severity {
  if (p.probe === 'fresh_food') return minutesAbove4c >= ctx.settings.foodAtRiskMinutes ? 'critical' : 'urgent';
  return valueC > 0 ? 'critical' : 'urgent';
}

/**
 * Recovery needs the cycle-averaged level back near the limit too, not just the readings
 * under the alarm line: a freezer hovering just under it has not recovered (hysteresis).
 */
function isLevelRecovered(ctx: EngineContext, p: ProbeState): boolean {
  const levelC = p.level.levelC;
  if (levelC === null) return true;
  const { settings } = ctx;
  const limitC = hot.limitOf(p.probe, settings);
  return levelC <= limitC + (hot.alarmLimitOf(p.probe, settings) - limitC) / 2;
}

/**
 * Time above the limit is credited only between two readings that both show it, and a gap
 * counts for at most two reading intervals: sparse or missing readings never stretch a
 * door opening into an alarm.
 */
function creditAbove(ctx: EngineContext, p: ProbeState, isAbove: boolean, atMs: number): void {
  const t = p.overTemp;
  if (isAbove && t.lastWasAbove && t.lastValidAtMs !== null) {
    const capMinutes = 2 * Math.max(1, ctx.state.intervalMin ?? 1);
    t.aboveMinutes += Math.min((atMs - t.lastValidAtMs) / MINUTE_MS, capMinutes);
  }
  t.lastValidAtMs = atMs;
  t.lastWasAbove = isAbove;
}

export function judgeOverTemp(ctx: EngineContext, p: ProbeState, valueC: number, atMs: number): void {
  const t = p.overTemp;
  // The usual case: a cold reading with nothing pending.
  if (t.findingId === null && t.aboveSinceMs === null && valueC <= hot.alarmLimitOf(p.probe, ctx.settings)) {
    t.belowSinceMs ??= atMs;
    t.lastValidAtMs = atMs;
    t.lastWasAbove = false;
    return;
  }
  const limitC = hot.limitOf(p.probe, ctx.settings);
  const open = hot.findOpen(ctx.state, t.findingId);
  const isAbove = valueC > hot.alarmLimitOf(p.probe, ctx.settings);
  if (isAbove) {
    t.aboveSinceMs ??= atMs;
    t.belowSinceMs = null;
  } else {
    t.belowSinceMs ??= atMs;
    if (atMs - t.belowSinceMs >= ctx.settings.overTempDipToleranceMinutes * MINUTE_MS) {
      t.aboveSinceMs = null;
      t.aboveMinutes = 0;
    }
  }
  creditAbove(ctx, p, isAbove, atMs);
  if (open) {
    if (t.belowSinceMs !== null && atMs - t.belowSinceMs >= ctx.settings.recoveredHoldMinutes * MINUTE_MS && isLevelRecovered(ctx, p)) {
      closeFinding(ctx.state, open.id, t.belowSinceMs, ctx.events);
      t.findingId = null;
      t.aboveMinutes = 0;
    }
    return;
  }
  if (t.findingId !== null) t.findingId = null;
  if (!isAbove || t.aboveSinceMs === null || !hot.isTrusted(p) || hot.isSuspectStuck(p, atMs, ctx.settings)) return;
  const minutes = t.aboveMinutes;
  if (minutes < graceMinutes(ctx, p)) return;
  const finding = openFinding(
    ctx.state,
    {
      kind: 'over-temperature',
      compartment: p.probe,
      startedAtMs: t.aboveSinceMs,
      detectedAtMs: atMs,
      severity: 'urgent',
      probableCauses: currentCauses(ctx),
      summary: overTempSummary(p.probe, valueC, limitC, (atMs - t.aboveSinceMs) / MINUTE_MS),
    },
    ctx.events,
  );
  finding.severity = severityFor(p, valueC, finding.minutesAbove4c, ctx);
  ctx.events[ctx.events.length - 1].finding.severity = finding.severity;
  t.findingId = finding.id;
}

/** Running figures of an open over-temperature finding, refreshed once per bucket. */
export function overTempPatch(ctx: EngineContext, p: ProbeState, atMs: number) {
  const finding = hot.findOpen(ctx.state, p.overTemp.findingId);
  const valueC = p.validation.lastValidC;
  if (!finding || valueC === null) return null;
  const limitC = hot.limitOf(p.probe, ctx.settings);
  return {
    finding,
    patch: {
      severity: severityFor(p, valueC, finding.minutesAbove4c, ctx),
      // Once back under the limit the summary keeps its last words from the warm spell.
      summary: valueC > limitC ? overTempSummary(p.probe, valueC, limitC, (atMs - finding.startedAtMs) / MINUTE_MS) : undefined,
    },
  };
}
