/**
 * Whole traces for tests and demos: settle the appliance for warmupMs (default 6 h) before
 * startMs so the thermostat, defrost clock and contents are in their rhythm, then sample every
 * intervalMs over [startMs, startMs + durationMs). Lost readings are left out, as a real sensor
 * feed would simply not contain them.
 */
import type { SimSample, TraceOptions } from './types';
import { ApplianceSimulator } from './simulator';

const DEFAULT_WARMUP_MS = 6 * 3_600_000;

export function generateTrace(o: TraceOptions): SimSample[] {
  if (!(o.intervalMs > 0)) throw new RangeError('intervalMs must be positive');
  const warmupMs = o.warmupMs ?? DEFAULT_WARMUP_MS;
  const simulator = new ApplianceSimulator(o.profile, {
    seed: o.seed,
    startMs: o.startMs - warmupMs,
    faults: o.faults,
    extraEvents: o.extraEvents,
    stepMs: o.stepMs,
  });
  const samples: SimSample[] = [];
  const endMs = o.startMs + o.durationMs;
  for (let atMs = o.startMs; atMs < endMs; atMs += o.intervalMs) {
    simulator.advanceTo(atMs);
    const sample = simulator.sample();
    if (sample !== null) samples.push(sample);
  }
  return samples;
}
