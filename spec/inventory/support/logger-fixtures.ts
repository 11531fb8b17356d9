import { defaultProfile, generateTrace, type FaultCode } from '../../../simulator/model';

export const HOUR_MS = 3_600_000;
export const DAY_MS = 24 * HOUR_MS;
/** A fixed start, safely in the past so no reading is "in the future". */
export const TRACE_START_MS = Date.UTC(2026, 0, 5);

export interface TraceCsv {
  text: string;
  rows: number;
  onsetMs: number | null;
}

/**
 * A logger file in the DESIGN.md format from the simulator: a top-freezer refrigerator,
 * one reading every `intervalMinutes`, optionally with a fault from `faultAfterHours`.
 */
export function traceCsv(options: { days: number; intervalMinutes: number; fault?: FaultCode; faultAfterHours?: number; seed?: number }): TraceCsv {
  const onsetMs = options.fault ? TRACE_START_MS + (options.faultAfterHours ?? 36) * HOUR_MS : null;
  const samples = generateTrace({
    profile: defaultProfile('top-freezer'),
    seed: options.seed ?? 7,
    startMs: TRACE_START_MS,
    durationMs: options.days * DAY_MS,
    intervalMs: options.intervalMinutes * 60_000,
    faults: options.fault && onsetMs !== null ? [{ fault: options.fault, startMs: onsetMs }] : [],
  });
  const cell = (value: number | null) => (value === null ? '' : value.toFixed(2));
  const lines = samples.map((s) => `${new Date(s.atMs).toISOString()},${cell(s.freshFoodC)},${cell(s.freezerC)}`);
  return { text: ['timestamp,fresh_food_c,freezer_c', ...lines].join('\n') + '\n', rows: lines.length, onsetMs };
}
