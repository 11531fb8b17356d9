/**
 * Small statistics over simulated traces, shared by the simulator specs.
 */
import type { SimSample } from '../../simulator/model';

export const MINUTE_MS = 60_000;
export const HOUR_MS = 60 * MINUTE_MS;
export const DAY_MS = 24 * HOUR_MS;
/** A Monday at midnight UTC, far from any daylight-saving change. */
export const START_MS = Date.UTC(2026, 0, 5);

export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) throw new Error('quantile of no values');
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(q * (sorted.length - 1))];
}

export function median(values: readonly number[]): number {
  return quantile(values, 0.5);
}

export function freshValues(trace: readonly SimSample[]): number[] {
  return trace.map((s) => s.freshFoodC).filter((v): v is number => v !== null);
}

export function freezerValues(trace: readonly SimSample[]): number[] {
  return trace.map((s) => s.freezerC).filter((v): v is number => v !== null);
}

export function between(trace: readonly SimSample[], fromMs: number, toMs: number): SimSample[] {
  return trace.filter((s) => s.atMs >= fromMs && s.atMs < toMs);
}

/** Share of samples with the compressor running (ground truth). */
export function dutyCycle(trace: readonly SimSample[]): number {
  return trace.filter((s) => s.compressorOn).length / trace.length;
}

/** Compressor starts per day (ground truth). */
export function compressorStartsPerDay(trace: readonly SimSample[]): number {
  let starts = 0;
  for (let i = 1; i < trace.length; i++) if (trace[i].compressorOn && !trace[i - 1].compressorOn) starts++;
  const days = (trace[trace.length - 1].atMs - trace[0].atMs) / DAY_MS;
  return starts / days;
}
