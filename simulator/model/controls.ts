/**
 * The appliance's control board, as in a common electronic frost-free unit (common practice):
 * - a thermostat latch per compartment on its lagged air temperature (compartment.ts): demand starts above
 *   set + band/2 and ends below set − band/2;
 * - the compressor relay closes while either compartment demands, with a minimum off time (to
 *   let the pressures equalise before a restart) and a minimum on time;
 * - the evaporator fan runs whenever the relay is closed (also if the compressor fails to start
 *   or its overload protector has tripped);
 * - the damper opens while the fresh-food section demands (and stays put without power);
 * - automatic defrost every `defrostIntervalH` hours of powered time, start to start:
 *   compressor and fan stop, the heater runs until the coil reaches +10 °C (termination
 *   thermostat) or 4 min before the end, then the drip time lets the water run off.
 * Without power nothing runs and the defrost clock stands still.
 */
import type { ApplianceProfile } from './types';
import type { FaultEffects } from './faults';

const DEFROST_TERMINATION_C = 10;
const DRIP_S = 240;
const OVERLOAD_RESET_S = 480;

export class Controls {
  freshDemand = false;
  freezerDemand = false;
  relayClosed = false;
  compressorRunning = false;
  fanRunning = false;
  heaterOn = false;
  damperOpen = false;
  private lastSwitchMs = -Infinity;
  private sinceDefrostS: number;
  private defrostRemainingS = 0;
  private heaterDone = false;
  private runStartMs = -Infinity;
  private overloadUntilMs = -Infinity;

  constructor(
    private readonly p: ApplianceProfile,
    private readonly hasFresh: boolean,
    private readonly hasFreezer: boolean,
    defrostPhase: number,
  ) {
    this.sinceDefrostS = (p.defrostIntervalH ?? 0) * 3600 * defrostPhase;
  }

  get defrosting(): boolean {
    return this.defrostRemainingS > 0;
  }

  update(atMs: number, dtS: number, freshAirC: number, freezerAirC: number, coilC: number, effects: FaultEffects): void {
    const powered = effects.powered;
    if (powered) this.advanceDefrost(dtS, coilC);
    this.updateDemand(freshAirC, freezerAirC);
    const wantsCooling = powered && !this.defrosting && (this.freshDemand || this.freezerDemand);
    this.switchRelay(atMs, wantsCooling, powered && !this.defrosting);
    this.updateCompressor(atMs, effects);
    this.fanRunning = this.relayClosed;
    this.heaterOn = powered && this.defrosting && !this.heaterDone;
    // A motorised damper stays where it was when the power goes.
    if (powered) this.damperOpen = this.freshDemand;
  }

  /** The compressor runs with the relay unless it cannot start or its overload has tripped. */
  private updateCompressor(atMs: number, effects: FaultEffects): void {
    const wasRunning = this.compressorRunning;
    this.compressorRunning = this.relayClosed && effects.compressorCanRun && atMs >= this.overloadUntilMs;
    if (!this.compressorRunning) return;
    if (!wasRunning) this.runStartMs = atMs;
    const runS = (atMs - this.runStartMs) / 1000;
    if (effects.overloadTripAfterS > 0 && runS >= effects.overloadTripAfterS) {
      this.overloadUntilMs = atMs + OVERLOAD_RESET_S * 1000;
      this.compressorRunning = false;
    }
  }

  private advanceDefrost(dtS: number, coilC: number): void {
    const intervalH = this.p.defrostIntervalH;
    if (intervalH === null) return;
    this.sinceDefrostS += dtS;
    if (this.defrosting) {
      this.defrostRemainingS -= dtS;
      if (coilC >= DEFROST_TERMINATION_C || this.defrostRemainingS <= DRIP_S) this.heaterDone = true;
      return;
    }
    if (this.sinceDefrostS < intervalH * 3600) return;
    this.sinceDefrostS = 0;
    this.defrostRemainingS = this.p.defrostDurationMin * 60;
    this.heaterDone = false;
  }

  private updateDemand(freshAirC: number, freezerAirC: number): void {
    const p = this.p;
    if (this.hasFresh) this.freshDemand = latch(this.freshDemand, freshAirC, p.freshFoodSetpointC, p.freshFoodHysteresisK);
    if (this.hasFreezer) this.freezerDemand = latch(this.freezerDemand, freezerAirC, p.freezerSetpointC, p.freezerHysteresisK);
  }

  /** Minimum on/off times apply to thermostat switching; power loss and defrost open at once. */
  private switchRelay(atMs: number, wantsCooling: boolean, allowed: boolean): void {
    if (!allowed) {
      if (this.relayClosed) this.lastSwitchMs = atMs;
      this.relayClosed = false;
      return;
    }
    const sinceSwitchS = (atMs - this.lastSwitchMs) / 1000;
    if (wantsCooling && !this.relayClosed && sinceSwitchS >= this.p.compressorMinOffS) {
      this.relayClosed = true;
      this.lastSwitchMs = atMs;
    } else if (!wantsCooling && this.relayClosed && sinceSwitchS >= this.p.compressorMinOnS) {
      this.relayClosed = false;
      this.lastSwitchMs = atMs;
    }
  }
}

function latch(demand: boolean, airC: number, setpointC: number, bandK: number): boolean {
  if (airC > setpointC + bandK / 2) return true;
  if (airC < setpointC - bandK / 2) return false;
  return demand;
}
