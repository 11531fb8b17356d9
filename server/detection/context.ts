/** What every judgement of the engine works on: its state, its settings and the events of this reading. */
import type { Probe } from '../../shared/domain';
import type { DetectionSettings } from './settings';
import type { EngineState, ProbeState } from './state';
import { isRepairFinding, type EngineEvent } from './types';

export interface EngineContext {
  state: EngineState;
  settings: DetectionSettings;
  events: EngineEvent[];
}

export const MINUTE_MS = 60_000;
export const HOUR_MS = 60 * MINUTE_MS;

export function limitOf(probe: Probe, settings: DetectionSettings): number {
  return probe === 'fresh_food' ? settings.freshFoodLimitC : settings.freezerLimitC;
}

/** The value a single reading must exceed to count as over temperature. */
export function alarmLimitOf(probe: Probe, settings: DetectionSettings): number {
  return probe === 'fresh_food' ? settings.freshFoodLimitC : settings.freezerLimitC + settings.freezerAlarmMarginC;
}

export function minRiseOf(probe: Probe, settings: DetectionSettings): number {
  return probe === 'fresh_food' ? settings.freshMinRiseC : settings.freezerMinRiseC;
}

export function probeState(state: EngineState, probe: Probe): ProbeState | undefined {
  return state.probes.find((p) => p.probe === probe);
}

/** Values of a probe with a stuck, jumping or impossible sensor are not evidence of anything. */
export function isTrusted(p: ProbeState): boolean {
  const reason = p.validation.faultReason;
  return reason === null || reason === 'disconnected' || reason === 'power-on' || reason === 'dropout';
}

/** A probe that has not moved at all for a while may be stuck: it starts no repair finding. */
export function isSuspectStuck(p: ProbeState, atMs: number, settings: DetectionSettings): boolean {
  const since = p.validation.sameSinceMs;
  return since !== null && atMs - since >= settings.stuckSuspectMinutes * 60_000;
}

export function hasOpenRepair(state: EngineState): boolean {
  return state.findings.some(isRepairFinding);
}

/** The probe whose air shows the automatic defrost: the one next to the evaporator coil. */
export function defrostProbe(state: EngineState): ProbeState | undefined {
  return probeState(state, 'freezer') ?? probeState(state, 'fresh_food');
}
