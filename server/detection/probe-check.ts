/**
 * Sensor checks for one probe: sentinel codes, impossible values and jumps, stuck values and
 * dropouts. A value that fails never reaches the temperature analysis; a probe that keeps
 * failing gets a sensor-fault finding, which never sends a technician by itself.
 */
import type { DetectionSettings } from './settings';
import { pushRing, type ProbeValidation, type SensorFaultReason } from './state';

const MINUTE_MS = 60_000;
const GLITCH_RING = 16;

export type ValueVerdict = 'valid' | 'missing' | SensorFaultReason;

function isSentinel(valueC: number, sentinelC: number, settings: DetectionSettings): boolean {
  return Math.abs(valueC - sentinelC) <= settings.sentinelToleranceC;
}

function sentinelReason(valueC: number, settings: DetectionSettings): SensorFaultReason | null {
  const sentinels = settings.sentinelValuesC;
  for (let i = 0; i < sentinels.length; i++) {
    // The first code means "disconnected", the second "power-on"; any further ones count as disconnected.
    if (isSentinel(valueC, sentinels[i], settings)) return i === 1 ? 'power-on' : 'disconnected';
  }
  return null;
}

/** A jump too fast for cabinet air; a second reading agreeing with the new value accepts it. */
function isImpossibleJump(v: ProbeValidation, valueC: number, atMs: number, settings: DetectionSettings): boolean {
  if (v.lastValidC === null || v.lastValidAtMs === null) return false;
  const minutes = (atMs - v.lastValidAtMs) / MINUTE_MS;
  const allowedC = Math.max(settings.impossibleJumpFloorC, settings.impossibleJumpCPerMinute * minutes);
  if (Math.abs(valueC - v.lastValidC) <= allowedC) return false;
  if (v.pendingJumpC !== null && Math.abs(valueC - v.pendingJumpC) <= 1) return false;
  v.pendingJumpC = valueC;
  return true;
}

function isStuck(v: ProbeValidation, valueC: number, atMs: number, settings: DetectionSettings): boolean {
  if (v.sameValueC !== null && Math.abs(valueC - v.sameValueC) <= settings.stuckToleranceC) {
    return v.sameSinceMs !== null && atMs - v.sameSinceMs >= settings.stuckMinutes * MINUTE_MS;
  }
  v.sameValueC = valueC;
  v.sameSinceMs = atMs;
  return false;
}

/**
 * Judges one value. `stuckAllowed` is false while a repair finding is open: a cabinet that
 * has settled at room temperature may legitimately read the same value for hours.
 */
export function judgeValue(
  v: ProbeValidation,
  valueC: number | null,
  atMs: number,
  settings: DetectionSettings,
  stuckAllowed: boolean,
): ValueVerdict {
  if (valueC === null || Number.isNaN(valueC)) return 'missing';
  const sentinel = sentinelReason(valueC, settings);
  if (sentinel) return sentinel;
  if (valueC < settings.plausibleMinC || valueC > settings.plausibleMaxC) return 'implausible';
  if (isImpossibleJump(v, valueC, atMs, settings)) return 'jumps';
  if (isStuck(v, valueC, atMs, settings) && stuckAllowed) return 'stuck';
  return 'valid';
}

export type FaultChange = 'opened' | 'closed' | null;

/** Records the verdict and says whether the probe's sensor fault opens or closes now. */
export function recordVerdict(v: ProbeValidation, verdict: ValueVerdict, valueC: number | null, atMs: number, settings: DetectionSettings): FaultChange {
  if (verdict === 'valid') return recordGood(v, valueC as number, atMs, settings);
  v.goodSinceMs = null;
  if (v.badSinceMs === null) v.badSinceMs = atMs;
  if (verdict !== 'missing') {
    if (v.badReason === null || v.badReason === 'dropout') v.badReason = verdict;
    if (verdict !== 'stuck') pushRing(v.glitchTimesMs, atMs, GLITCH_RING);
  }
  if (v.faultReason !== null) return null;
  const reason = faultReasonNow(v, verdict, atMs, settings);
  if (reason === null) return null;
  v.faultReason = reason;
  return 'opened';
}

function recordGood(v: ProbeValidation, valueC: number, atMs: number, settings: DetectionSettings): FaultChange {
  v.lastValidC = valueC;
  v.lastValidAtMs = atMs;
  v.pendingJumpC = null;
  v.badSinceMs = null;
  v.badReason = null;
  if (v.goodSinceMs === null) v.goodSinceMs = atMs;
  if (v.faultReason === null) return null;
  const steadyMs = settings.sensorRecoveredMinutes * MINUTE_MS;
  const recentGlitch = v.glitchTimesMs.length > 0 && atMs - v.glitchTimesMs[v.glitchTimesMs.length - 1] < steadyMs;
  if (atMs - v.goodSinceMs < steadyMs || recentGlitch) return null;
  v.faultReason = null;
  return 'closed';
}

function glitchesInWindow(v: ProbeValidation, atMs: number, settings: DetectionSettings): number {
  const fromMs = atMs - settings.jumpCountWindowHours * 60 * MINUTE_MS;
  let count = 0;
  for (const t of v.glitchTimesMs) if (t >= fromMs) count++;
  return count;
}

function faultReasonNow(v: ProbeValidation, verdict: ValueVerdict, atMs: number, settings: DetectionSettings): SensorFaultReason | null {
  if (verdict === 'stuck') return 'stuck';
  if (verdict !== 'missing' && glitchesInWindow(v, atMs, settings) >= settings.jumpsForSensorFault) return verdict as SensorFaultReason;
  const lastGoodMs = v.lastValidAtMs ?? v.badSinceMs ?? atMs;
  if (atMs - lastGoodMs >= settings.dropoutMinutes * MINUTE_MS) return v.badReason ?? 'dropout';
  return null;
}
