import fs from 'node:fs';
import { ApplianceSimulator, type FaultCode, type ScheduledFault } from '../model';
import { DeviceLink, readingPayload } from './device-link';
import type { FleetDevice } from './fleet';

/** Where each device stopped, so a restart continues its history instead of repeating it. */
export type ResumeState = Record<string, { lastAtMs: number; seq: number }>;

export interface RunnerOptions {
  mqttUrl: string;
  devices: FleetDevice[];
  faultsFor: (device: FleetDevice) => ScheduledFault[];
  /** First simulated reading time (before resume state is applied). */
  startMs: number;
  /** Until this time, readings are written at full speed (the backfill); after it, at `speed`. */
  replayFromMs: number;
  speed: number;
  /** Let simulated time run ahead of the wall clock (readings from the future). */
  allowFuture: boolean;
  intervalSecondsOverride: number | null;
  resume: ResumeState;
  stateFile: string | null;
  tickMs: number;
  log: (message: string) => void;
}

const WARMUP_MS = 6 * 3_600_000;
const MECHANICAL_FAULTS: readonly FaultCode[] = ['evaporator-fan', 'defrost-system', 'condenser-airflow', 'compressor-start', 'air-damper', 'door-seal'];
/** A slow fault (a dead defrost heater frosts the coil for days) is replayed from its start, up to this far back. */
const MAX_FAULT_WARMUP_MS = 21 * 86_400_000;
const SAVE_EVERY_MS = 10_000;

/** Simulation start for a device first sampled at firstAtMs: six hours before, or back to a fault still under way. */
export function warmupStartMs(firstAtMs: number, faults: readonly ScheduledFault[]): number {
  const ongoing = faults.filter((fault) => fault.startMs < firstAtMs && (fault.endMs === null || fault.endMs === undefined || fault.endMs > firstAtMs));
  const earliestMs = Math.min(firstAtMs - WARMUP_MS, ...ongoing.map((fault) => fault.startMs - WARMUP_MS));
  return Math.max(earliestMs, firstAtMs - MAX_FAULT_WARMUP_MS);
}

class DeviceRun {
  seq: number;
  nextAtMs: number;
  published = 0;

  constructor(
    readonly device: FleetDevice,
    readonly sim: ApplianceSimulator,
    readonly link: DeviceLink,
    readonly intervalMs: number,
    firstAtMs: number,
    seq: number,
  ) {
    this.nextAtMs = firstAtMs;
    this.seq = seq;
  }

  /** Simulates and publishes every reading due up to `untilMs`. */
  async runUntil(untilMs: number): Promise<void> {
    while (this.nextAtMs <= untilMs) {
      this.sim.advanceTo(this.nextAtMs);
      const sample = this.sim.sample();
      // A lost reading still used up its sequence number: the gap is how loss shows.
      const seq = this.seq++;
      this.nextAtMs += this.intervalMs;
      if (!sample) continue;
      await this.link.publish(readingPayload(this.device.deviceId, seq, sample));
      this.published++;
    }
  }
}

/** Plays a fleet: backfill at full speed, then live at `speed` (capped at the wall clock). */
export class FleetRunner {
  private runs: DeviceRun[] = [];
  private timer: NodeJS.Timeout | null = null;
  private lastSaveMs = 0;
  private simNowMs = 0;
  private ticking = false;

  constructor(private readonly options: RunnerOptions) {}

  get simulatedNowMs(): number {
    return this.simNowMs;
  }

  get published(): number {
    return this.runs.reduce((sum, run) => sum + run.published, 0);
  }

  async start(): Promise<void> {
    const { options } = this;
    this.runs = await Promise.all(options.devices.map((device) => this.openRun(device)));
    options.log(`${this.runs.length} sensors signed in to ${options.mqttUrl}`);
    const backfillUntilMs = Math.min(options.replayFromMs, Date.now());
    if (this.runs.some((run) => run.nextAtMs <= backfillUntilMs)) {
      const started = Date.now();
      await Promise.all(this.runs.map((run) => run.runUntil(backfillUntilMs)));
      await Promise.all(this.runs.map((run) => run.link.drain()));
      options.log(`backfill to ${new Date(backfillUntilMs).toISOString()}: ${this.published} readings in ${((Date.now() - started) / 1000).toFixed(1)} s`);
    }
    // After a restart the sensors may be far past the replay's start (the state file says
    // where they got): the clock starts there, so readings flow at once instead of after
    // the replay has idled its way up to them.
    const resumeAtMs = Math.min(...this.runs.map((run) => run.nextAtMs)) - 1;
    const anchorMs = Math.min(Date.now(), Math.max(backfillUntilMs, resumeAtMs));
    this.simNowMs = anchorMs;
    this.saveState(true);
    this.startClock(anchorMs);
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    await Promise.all(this.runs.map((run) => run.link.close().catch(() => undefined)));
    this.saveState(true);
  }

  /** Fault on command: starts now in simulated time. */
  inject(deviceId: string, fault: ScheduledFault): boolean {
    const run = this.runs.find((candidate) => candidate.device.deviceId === deviceId);
    if (!run) return false;
    run.sim.injectFault({ ...fault, startMs: Math.max(fault.startMs, run.sim.nowMs) });
    return true;
  }

  clear(deviceId: string, fault: FaultCode): boolean {
    const run = this.runs.find((candidate) => candidate.device.deviceId === deviceId);
    if (!run) return false;
    run.sim.clearFault(fault, run.sim.nowMs);
    return true;
  }

  /** A technician's repair: every fault on the appliance's parts ends now (sensor faults stay). */
  repair(deviceId: string): boolean {
    const run = this.runs.find((candidate) => candidate.device.deviceId === deviceId);
    if (!run) return false;
    for (const fault of MECHANICAL_FAULTS) run.sim.clearFault(fault, run.sim.nowMs);
    return true;
  }

  private async openRun(device: FleetDevice): Promise<DeviceRun> {
    const { options } = this;
    const intervalMs = (options.intervalSecondsOverride ?? device.intervalSeconds) * 1000;
    const resumed = options.resume[device.deviceId];
    const firstAtMs = resumed ? Math.max(options.startMs, resumed.lastAtMs + intervalMs) : options.startMs;
    const faults = options.faultsFor(device);
    const sim = new ApplianceSimulator(device.profile, { seed: device.seed, startMs: warmupStartMs(firstAtMs, faults), faults });
    sim.advanceTo(firstAtMs);
    const link = await DeviceLink.open(options.mqttUrl, device);
    return new DeviceRun(device, sim, link, intervalMs, firstAtMs, resumed ? resumed.seq + 1 : 0);
  }

  private startClock(anchorSimMs: number): void {
    const { options } = this;
    const anchorWallMs = Date.now();
    let capped = false;
    this.timer = setInterval(() => {
      if (this.ticking) return;
      const wallMs = Date.now();
      let simMs = anchorSimMs + (wallMs - anchorWallMs) * options.speed;
      if (!options.allowFuture && simMs > wallMs) {
        if (!capped && options.speed > 1) options.log('caught up with the wall clock: continuing in real time');
        capped = true;
        simMs = wallMs;
      }
      this.simNowMs = simMs;
      this.ticking = true;
      Promise.all(this.runs.map((run) => run.runUntil(simMs)))
        .then(() => this.saveState(false))
        .catch((error: Error) => options.log(`publishing failed: ${error.message}`))
        .finally(() => (this.ticking = false));
    }, options.tickMs);
  }

  private saveState(force: boolean): void {
    const { stateFile } = this.options;
    if (!stateFile || (!force && Date.now() - this.lastSaveMs < SAVE_EVERY_MS)) return;
    this.lastSaveMs = Date.now();
    const state: ResumeState = { ...this.options.resume };
    for (const run of this.runs) {
      if (run.seq > 0) state[run.device.deviceId] = { lastAtMs: run.nextAtMs - run.intervalMs, seq: run.seq - 1 };
    }
    fs.writeFileSync(stateFile, JSON.stringify(state));
  }
}
