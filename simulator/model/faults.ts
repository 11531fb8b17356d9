/**
 * Scheduled faults and what each does to the machine. Each fault turns into a few factors the
 * physics reads every step; severity (0..1, default 1) scales them. The signatures follow
 * common practice of the repair trade (from memory):
 * - evaporator-fan: airflow over the coil × (1 − severity); at 1 only natural convection is left.
 *   The fresh-food section then settles where the room and the partition balance: near 10 °C in
 *   a 22 °C room (the trade's figure), 4–7 °C in an 18–20 °C room, about 12 °C at 28 °C; the
 *   freezer, not cold enough, is the steadier sign (−13..−2 °C over random profiles).
 * - defrost-system: heater power × (1 − severity); the defrost timer still stops the compressor,
 *   frost builds up and chokes the air paths (fresh-food duct first).
 * - condenser-airflow: compressor capacity × (1 − 0.6·severity), a further 3 %·severity lost
 *   per K of room above 24 °C (a hot day makes it worse); the hot compressor's overload
 *   protector trips after an hour of continuous running (severity ≥ 0.3) and resets after 8 min.
 * - compressor-start: the compressor never runs; fan, controls and defrost timer still do.
 * - air-damper: the damper is stuck closed; severity 1 leaves only the normal leak.
 * - door-seal: extra infiltration of room air (and frost) into both compartments, more exchange
 *   while a door is open.
 * - power-loss: nothing runs (compressor, fans, heater, defrost timer); the battery sensor reports.
 * - sensor faults act on the readings only (see probe.ts).
 * A fault on a part the style lacks does nothing: evaporator-fan on a cold-wall chest freezer,
 * defrost-system on a unit without automatic defrost, air-damper on a single-compartment unit.
 */
import type { Probe } from '../../shared/domain';
import type { FaultCode, ScheduledFault } from './types';

export interface SensorEffect {
  /** Probability that a reading shows the disconnected sentinel. */
  disconnected: number;
  /** Probability that a reading shows the power-on sentinel. */
  powerOn: number;
  stuck: boolean;
  /** Probability that a reading is missing. */
  dropout: number;
}

export interface FaultEffects {
  powered: boolean;
  compressorCanRun: boolean;
  fanAirflowFactor: number;
  capacityFactor: number;
  condenserHotLossPerK: number;
  /** Continuous run after which the compressor's overload protector trips (0 = never). */
  overloadTripAfterS: number;
  heaterFactor: number;
  /** 0 = damper works, 1 = stuck fully closed. */
  damperClosed: number;
  /** 0 = good seal, 1 = badly torn or sprung. */
  sealLeak: number;
  freshFood: SensorEffect;
  freezer: SensorEffect;
}

function noSensorEffect(): SensorEffect {
  return { disconnected: 0, powerOn: 0, stuck: false, dropout: 0 };
}

export function noFaultEffects(): FaultEffects {
  return {
    powered: true,
    compressorCanRun: true,
    fanAirflowFactor: 1,
    capacityFactor: 1,
    condenserHotLossPerK: 0,
    overloadTripAfterS: 0,
    heaterFactor: 1,
    damperClosed: 0,
    sealLeak: 0,
    freshFood: noSensorEffect(),
    freezer: noSensorEffect(),
  };
}

function resetSensor(effect: SensorEffect): void {
  effect.disconnected = 0;
  effect.powerOn = 0;
  effect.stuck = false;
  effect.dropout = 0;
}

function reset(effects: FaultEffects): void {
  effects.powered = true;
  effects.compressorCanRun = true;
  effects.fanAirflowFactor = 1;
  effects.capacityFactor = 1;
  effects.condenserHotLossPerK = 0;
  effects.overloadTripAfterS = 0;
  effects.heaterFactor = 1;
  effects.damperClosed = 0;
  effects.sealLeak = 0;
  resetSensor(effects.freshFood);
  resetSensor(effects.freezer);
}

export function isActive(fault: ScheduledFault, atMs: number): boolean {
  return fault.startMs <= atMs && (fault.endMs === undefined || fault.endMs === null || atMs < fault.endMs);
}

export function severityOf(fault: ScheduledFault): number {
  const severity = fault.severity ?? 1;
  return Math.min(1, Math.max(0, severity));
}

/** Fills `effects` (reused, no allocation) from the faults active at atMs. */
export function resolveFaults(faults: readonly ScheduledFault[], atMs: number, effects: FaultEffects): void {
  reset(effects);
  for (let i = 0; i < faults.length; i++) {
    const fault = faults[i];
    if (isActive(fault, atMs)) applyFault(fault.fault, severityOf(fault), fault.probe, effects);
  }
}

function applyFault(code: FaultCode, severity: number, probe: Probe | undefined, e: FaultEffects): void {
  switch (code) {
    case 'power-loss':
      e.powered = false;
      return;
    case 'compressor-start':
      e.compressorCanRun = false;
      return;
    case 'evaporator-fan':
      e.fanAirflowFactor = Math.min(e.fanAirflowFactor, 1 - severity);
      return;
    case 'condenser-airflow':
      e.capacityFactor = Math.min(e.capacityFactor, 1 - 0.6 * severity);
      e.condenserHotLossPerK = Math.max(e.condenserHotLossPerK, 0.03 * severity);
      if (severity >= 0.3) e.overloadTripAfterS = 3600 / severity;
      return;
    case 'defrost-system':
      e.heaterFactor = Math.min(e.heaterFactor, 1 - severity);
      return;
    case 'air-damper':
      e.damperClosed = Math.max(e.damperClosed, severity);
      return;
    case 'door-seal':
      e.sealLeak = Math.max(e.sealLeak, severity);
      return;
    default:
      applySensorFault(code, severity, probe, e);
  }
}

function applySensorFault(code: FaultCode, severity: number, probe: Probe | undefined, e: FaultEffects): void {
  if (probe !== 'freezer') applyToProbe(code, severity, e.freshFood);
  if (probe !== 'fresh_food') applyToProbe(code, severity, e.freezer);
}

function applyToProbe(code: FaultCode, severity: number, effect: SensorEffect): void {
  if (code === 'sensor-disconnected') effect.disconnected = Math.max(effect.disconnected, severity);
  else if (code === 'sensor-power-on') effect.powerOn = Math.max(effect.powerOn, severity);
  else if (code === 'sensor-stuck') effect.stuck = true;
  else if (code === 'sensor-dropout') effect.dropout = Math.max(effect.dropout, severity);
}
