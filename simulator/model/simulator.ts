/**
 * One simulated appliance: physics (physics.ts), control board (controls.ts), room and doors
 * (environment.ts, doors.ts), faults (faults.ts) and the sensor (probe.ts) stepped together.
 *
 * Three random streams come from the seed: the cabinet's own (defrost phase, event sizes), the
 * doors', and the sensor's (noise, lost readings). Sampling more or less often therefore does not
 * change when doors open. advanceTo integrates in whole internal steps (20 s by default) and a
 * last partial step up to the requested time.
 */
import { probesOf } from '../../shared/domain';
import type { Probe } from '../../shared/domain';
import type { ApplianceProfile, ExtraEvent, FaultCode, ScheduledFault, SimSample, SimulatorOptions } from './types';
import { Cabinet, newStepInputs, StepInputs } from './physics';
import { Controls } from './controls';
import { RoomClimate } from './environment';
import { DoorHabits } from './doors';
import { FaultEffects, isActive, noFaultEffects, resolveFaults } from './faults';
import { ProbeChannel } from './probe';
import { createRng, deriveSeed, Rng, uniform } from './rng';

const DEFAULT_STEP_MS = 20_000;
const YEAR_MS = 365.25 * 86_400_000;
/** Groceries: about 3.6 kJ/(kg·K) for chilled food, 2.5 for part-frozen (common practice, from memory). */
const FRESH_GROCERY_J_PER_KG_K = 3600;
const FROZEN_GROCERY_J_PER_KG_K = 2500;
const FRESH_GROCERY_C = 12;
const FROZEN_GROCERY_C = -5;
/** Putting the shopping away keeps the doors open a while. */
const GROCERY_FRESH_DOOR_S = 150;
const GROCERY_FREEZER_DOOR_S = 40;

/** What a real sensor cannot see: true air and food temperatures, coil, frost, room. */
export interface SimTruth {
  freshAirC: number;
  freshFoodC: number;
  freezerAirC: number;
  freezerFoodC: number;
  coilC: number;
  iceKg: number;
  roomC: number;
  defrosting: boolean;
  fanRunning: boolean;
  freshDoorOpen: boolean;
  freezerDoorOpen: boolean;
}

interface PendingLoad {
  atMs: number;
  kg: number;
}

export class ApplianceSimulator {
  private currentMs: number;
  private readonly startMs: number;
  private readonly stepMs: number;
  private readonly hasFresh: boolean;
  private readonly hasFreezer: boolean;
  private readonly cabinet: Cabinet;
  private readonly controls: Controls;
  private readonly climate: RoomClimate;
  private readonly doors: DoorHabits;
  private readonly faults: ScheduledFault[];
  private readonly loads: PendingLoad[] = [];
  private readonly effects: FaultEffects = noFaultEffects();
  private readonly inputs: StepInputs = newStepInputs();
  private readonly cabinetRng: Rng;
  private readonly sensorRng: Rng;
  private readonly freshProbe: ProbeChannel;
  private readonly freezerProbe: ProbeChannel;

  constructor(
    readonly profile: ApplianceProfile,
    opts: SimulatorOptions,
  ) {
    const probes = probesOf(profile.style);
    this.hasFresh = probes.includes('fresh_food');
    this.hasFreezer = probes.includes('freezer');
    this.currentMs = this.startMs = opts.startMs;
    this.stepMs = opts.stepMs ?? DEFAULT_STEP_MS;
    this.cabinetRng = createRng(deriveSeed(opts.seed, 1));
    this.sensorRng = createRng(deriveSeed(opts.seed, 3));
    this.cabinet = new Cabinet(profile, this.hasFresh, this.hasFreezer);
    this.cabinet.iceKg = 0.1 * this.cabinetRng();
    this.controls = new Controls(profile, this.hasFresh, this.hasFreezer, this.cabinetRng());
    this.climate = new RoomClimate(profile, this.cabinetRng);
    this.doors = new DoorHabits(profile, createRng(deriveSeed(opts.seed, 2)), opts.startMs);
    this.faults = (opts.faults ?? []).map((f) => ({ ...f }));
    this.freshProbe = new ProbeChannel(profile.freshFoodProbeOffsetC, profile.probeNoiseC);
    this.freezerProbe = new ProbeChannel(profile.freezerProbeOffsetC, profile.probeNoiseC);
    for (const event of opts.extraEvents ?? []) this.scheduleEvent(event);
  }

  get nowMs(): number {
    return this.currentMs;
  }

  injectFault(f: ScheduledFault): void {
    this.faults.push({ ...f });
  }

  /** Ends every instance of `fault` active at atMs (the repair). */
  clearFault(fault: FaultCode, atMs: number): void {
    for (const f of this.faults) if (f.fault === fault && isActive(f, atMs)) f.endMs = atMs;
  }

  scheduleEvent(event: ExtraEvent): void {
    if (event.kind === 'hot-day') {
      this.climate.addHotDay(event.atMs, event.magnitude ?? uniform(this.cabinetRng, 5, 10));
      return;
    }
    this.loads.push({ atMs: event.atMs, kg: event.magnitude ?? uniform(this.cabinetRng, 4, 10) });
    this.loads.sort((a, b) => a.atMs - b.atMs);
  }

  /** Opens a door now for durationS (a demo or a test; habits open doors by themselves). */
  openDoor(probe: Probe, durationS: number): void {
    const door = probe === 'freezer' ? this.doors.freezer : this.doors.freshFood;
    this.doors.openFor(door, this.currentMs, durationS, this.currentMs);
  }

  advanceTo(atMs: number): void {
    if (atMs < this.currentMs) throw new RangeError(`cannot go back in time to ${atMs} from ${this.currentMs}`);
    while (this.currentMs < atMs) {
      const dtMs = Math.min(this.stepMs, atMs - this.currentMs);
      this.step(this.currentMs, dtMs);
      this.currentMs += dtMs;
    }
  }

  private step(fromMs: number, dtMs: number): void {
    const toMs = fromMs + dtMs;
    const dtS = dtMs / 1000;
    const c = this.cabinet;
    resolveFaults(this.faults, fromMs, this.effects);
    this.doors.step(fromMs, toMs);
    while (this.loads.length > 0 && this.loads[0].atMs < toMs) this.loadGroceries(this.loads.shift()!, toMs);
    this.controls.update(fromMs, dtS, c.fresh.sensedC, c.freezer.sensedC, c.coilC, this.effects);
    this.fillInputs(fromMs);
    c.step(dtS, this.inputs);
  }

  private fillInputs(atMs: number): void {
    const s = this.inputs;
    const e = this.effects;
    const k = this.controls;
    s.roomC = this.climate.tempC(atMs);
    s.freshDoorOpenS = this.doors.freshFood.openSInStep;
    s.freezerDoorOpenS = this.doors.freezer.openSInStep;
    s.compressorRunning = k.compressorRunning;
    s.fanRunning = k.fanRunning;
    s.heaterOn = k.heaterOn;
    s.damperOpen = k.damperOpen;
    s.fanAirflowFactor = e.fanAirflowFactor;
    s.capacityFactor = e.capacityFactor;
    s.condenserHotLossPerK = e.condenserHotLossPerK;
    s.heaterFactor = e.heaterFactor;
    s.damperClosed = e.damperClosed;
    s.sealLeak = e.sealLeak;
  }

  /** Most goes to the fresh-food section at shopping-bag temperature, a fifth to the freezer. */
  private loadGroceries(load: PendingLoad, stepEndMs: number): void {
    const freezerShare = this.hasFresh ? (this.hasFreezer ? 0.2 : 0) : 1;
    const freshKg = load.kg * (1 - freezerShare);
    const frozenKg = load.kg * freezerShare;
    if (freshKg > 0) {
      this.cabinet.fresh.addLoad(freshKg, freshKg * FRESH_GROCERY_J_PER_KG_K, FRESH_GROCERY_C);
      this.doors.openFor(this.doors.freshFood, load.atMs, GROCERY_FRESH_DOOR_S, stepEndMs);
    }
    if (frozenKg > 0) {
      this.cabinet.freezer.addLoad(frozenKg, frozenKg * FROZEN_GROCERY_J_PER_KG_K, FROZEN_GROCERY_C);
      this.doors.openFor(this.doors.freezer, load.atMs, GROCERY_FREEZER_DOOR_S, stepEndMs);
    }
  }

  /** The reading the sensor would send now; null when it is lost or every probe drops out. */
  sample(): SimSample | null {
    const rng = this.sensorRng;
    if (rng() < this.profile.lossProbability) return null;
    resolveFaults(this.faults, this.currentMs, this.effects);
    const c = this.cabinet;
    const freshFoodC = this.hasFresh ? this.freshProbe.read(c.fresh.airC, this.effects.freshFood, rng) : null;
    const freezerC = this.hasFreezer ? this.freezerProbe.read(c.freezer.airC, this.effects.freezer, rng) : null;
    if (freshFoodC === null && freezerC === null) return null;
    return {
      atMs: this.currentMs,
      freshFoodC,
      freezerC,
      doorOpen: this.doors.freshFood.isOpen(this.currentMs) || this.doors.freezer.isOpen(this.currentMs),
      batteryV: this.batteryV(rng),
      // The relay state of the last step, unless a fault stopped the compressor since.
      compressorOn: this.controls.compressorRunning && this.effects.powered && this.effects.compressorCanRun,
    };
  }

  private batteryV(rng: Rng): number {
    const years = (this.currentMs - this.startMs) / YEAR_MS;
    const volts = this.profile.batteryStartV - this.profile.batteryDrainVPerYear * years + 0.01 * (rng() - 0.5);
    return Math.round(Math.max(0, volts) * 100) / 100;
  }

  /** Ground truth for tests and demos: the true air temperatures and machine state. */
  truth(): SimTruth {
    const c = this.cabinet;
    return {
      freshAirC: c.fresh.airC,
      freshFoodC: c.fresh.foodC,
      freezerAirC: c.freezer.airC,
      freezerFoodC: c.freezer.foodC,
      coilC: c.coilC,
      iceKg: c.iceKg,
      roomC: this.climate.tempC(this.currentMs),
      defrosting: this.controls.defrosting,
      fanRunning: this.controls.fanRunning,
      freshDoorOpen: this.doors.freshFood.isOpen(this.currentMs),
      freezerDoorOpen: this.doors.freezer.isOpen(this.currentMs),
    };
  }
}
