/**
 * over-temperature: a compartment above its food-safety limit (FDA 40 °F / 0 °F) for longer
 * than a grace period that a door opening or a defrost does not reach. Judged on every valid
 * reading so the alarm is as early as the grace period allows.
 */
import { closeFinding, findOpen, openFinding } from './finding-book';
import { alarmLimitOf, isTrusted, limitOf, MINUTE_MS, type EngineContext } from './context';
import { currentCauses } from './signature';
import type { Severity } from '../../shared/domain';
import type { ProbeState } from './state';
import { overTempSummary } from './summaries';

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

export function judgeOverTemp(ctx: EngineContext, p: ProbeState, valueC: number, atMs: number): void {
  const t = p.overTemp;
  const limitC = limitOf(p.probe, ctx.settings);
  if (valueC > alarmLimitOf(p.probe, ctx.settings)) {
    t.aboveSinceMs ??= atMs;
    t.belowSinceMs = null;
  } else {
    t.belowSinceMs ??= atMs;
    if (atMs - t.belowSinceMs >= ctx.settings.overTempDipToleranceMinutes * MINUTE_MS) t.aboveSinceMs = null;
  }
  const open = findOpen(ctx.state, t.findingId);
  if (open) {
    if (t.belowSinceMs !== null && atMs - t.belowSinceMs >= ctx.settings.recoveredHoldMinutes * MINUTE_MS) {
      closeFinding(ctx.state, open.id, t.belowSinceMs, ctx.events);
      t.findingId = null;
    }
    return;
  }
  if (t.findingId !== null) t.findingId = null;
  if (t.aboveSinceMs === null || !isTrusted(p)) return;
  const minutes = (atMs - t.aboveSinceMs) / MINUTE_MS;
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
      summary: overTempSummary(p.probe, valueC, limitC, minutes),
    },
    ctx.events,
  );
  finding.severity = severityFor(p, valueC, finding.minutesAbove4c, ctx);
  ctx.events[ctx.events.length - 1].finding.severity = finding.severity;
  t.findingId = finding.id;
}

/** Running figures of an open over-temperature finding, refreshed once per bucket. */
export function overTempPatch(ctx: EngineContext, p: ProbeState, atMs: number) {
  const finding = findOpen(ctx.state, p.overTemp.findingId);
  const valueC = p.validation.lastValidC;
  if (!finding || valueC === null) return null;
  const aboveSince = p.overTemp.aboveSinceMs ?? finding.startedAtMs;
  return {
    finding,
    patch: {
      severity: severityFor(p, valueC, finding.minutesAbove4c, ctx),
      summary: overTempSummary(p.probe, valueC, limitOf(p.probe, ctx.settings), (atMs - aboveSince) / MINUTE_MS),
    },
  };
}
