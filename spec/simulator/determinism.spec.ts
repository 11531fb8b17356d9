/**
 * Reproducible traces and widely varied, physically sane random appliances.
 */
import { APPLIANCE_STYLES } from '../../shared/domain';
import { FRESH_FOOD_LIMIT_C } from '../../shared/temperature';
import { createRng, defaultProfile, generateTrace, randomProfile } from '../../simulator/model';
import type { ApplianceProfile, TraceOptions } from '../../simulator/model';
import {
  DAY_MS,
  HOUR_MS,
  MINUTE_MS,
  START_MS,
  compressorStartsPerDay,
  dutyCycle,
  freezerValues,
  freshValues,
  median,
  quantile,
} from './trace-stats';

describe('simulator: determinism', () => {
  const options: TraceOptions = {
    profile: defaultProfile('bottom-freezer'),
    seed: 42,
    startMs: START_MS,
    durationMs: 2 * DAY_MS,
    intervalMs: 5 * MINUTE_MS,
    faults: [{ fault: 'evaporator-fan', startMs: START_MS + DAY_MS, severity: 0.7 }],
    extraEvents: [{ kind: 'grocery-load', atMs: START_MS + 10 * HOUR_MS }],
  };

  it('gives the same trace for the same seed', () => {
    expect(generateTrace(options)).toEqual(generateTrace(options));
  });

  it('gives another trace for another seed', () => {
    const a = generateTrace(options);
    const b = generateTrace({ ...options, seed: 43 });
    expect(a).not.toEqual(b);
  });

  it('repeats the pseudo-random sequence of a seed, within [0, 1)', () => {
    const first = createRng(7);
    const second = createRng(7);
    const values = Array.from({ length: 1000 }, () => first());
    expect(values).toEqual(Array.from({ length: 1000 }, () => second()));
    expect(values.every((v) => v >= 0 && v < 1)).toBeTrue();
    expect(Math.abs(values.reduce((sum, v) => sum + v, 0) / 1000 - 0.5)).toBeLessThan(0.05);
  });

  it('draws the same random profile from the same seed', () => {
    expect(randomProfile(createRng(5))).toEqual(randomProfile(createRng(5)));
    expect(randomProfile(createRng(5))).not.toEqual(randomProfile(createRng(6)));
  });

  it('does not let the sampling interval move the door openings', () => {
    const profile = { ...defaultProfile(), doorOpenMeanS: 120 };
    const fine = generateTrace({ profile, seed: 3, startMs: START_MS, durationMs: DAY_MS, intervalMs: MINUTE_MS });
    const coarse = generateTrace({ profile, seed: 3, startMs: START_MS, durationMs: DAY_MS, intervalMs: 5 * MINUTE_MS });
    const fineOpen = new Map(fine.map((s) => [s.atMs, s.doorOpen]));
    const shared = coarse.filter((s) => fineOpen.has(s.atMs));
    expect(shared.length).toBeGreaterThan(250);
    expect(shared.filter((s) => s.doorOpen).length).toBeGreaterThan(3);
    for (const s of shared) expect(s.doorOpen).toBe(fineOpen.get(s.atMs)!);
  });
});

describe('simulator: 200 random appliances', () => {
  const rng = createRng(2026);
  const profiles: ApplianceProfile[] = Array.from({ length: 200 }, () => randomProfile(rng));

  it('vary widely', () => {
    const spread = (pick: (p: ApplianceProfile) => number) => {
      const values = profiles.map(pick);
      return { min: Math.min(...values), max: Math.max(...values) };
    };
    const fresh = spread((p) => p.freshFoodSetpointC);
    const freezer = spread((p) => p.freezerSetpointC);
    const room = spread((p) => p.roomMeanC);
    const doors = spread((p) => p.doorOpeningsPerDay);
    const food = spread((p) => p.freshFoodContentsJPerK);
    const defrost = spread((p) => p.defrostIntervalH ?? NaN);
    const defrostHours = profiles.map((p) => p.defrostIntervalH).filter((h): h is number => h !== null);
    expect(fresh.max - fresh.min).toBeGreaterThan(1.5);
    expect(freezer.max - freezer.min).toBeGreaterThan(4);
    expect(room.max - room.min).toBeGreaterThan(8);
    expect(doors.max / doors.min).toBeGreaterThan(10);
    expect(food.max / food.min).toBeGreaterThan(3);
    // Common practice (from memory): automatic defrost every several hours to a few days.
    expect(Math.min(...defrostHours)).toBeLessThan(10);
    expect(Math.max(...defrostHours)).toBeGreaterThan(48);
    expect(Number.isNaN(defrost.min)).toBeTrue();
    expect(new Set(profiles.map((p) => p.style)).size).toBe(APPLIANCE_STYLES.length);
  });

  it('stay physically sane: healthy units keep food safe and the compressor cycling', () => {
    const failures: string[] = [];
    profiles.forEach((profile, index) => {
      const trace = generateTrace({
        profile,
        seed: index,
        startMs: START_MS,
        durationMs: 2 * DAY_MS,
        intervalMs: 5 * MINUTE_MS,
        warmupMs: 12 * HOUR_MS,
        stepMs: 30_000,
      });
      const problems = saneProblems(profile, trace);
      if (problems.length > 0) failures.push(`#${index} ${profile.style}: ${problems.join(', ')}`);
    });
    expect(failures).toEqual([]);
  });
});

function saneProblems(profile: ApplianceProfile, trace: ReturnType<typeof generateTrace>): string[] {
  const problems: string[] = [];
  const fresh = freshValues(trace);
  const freezer = freezerValues(trace);
  // FDA, "Refrigerator Thermometers: Cold Facts about Food Safety": fresh food at or below 4.4 °C;
  // door openings and defrost may briefly exceed it (5th–95th percentile), food must not freeze.
  if (fresh.length > 0) {
    if (median(fresh) > FRESH_FOOD_LIMIT_C) problems.push(`fresh median ${median(fresh)}`);
    if (quantile(fresh, 0.95) > 5.5) problems.push(`fresh p95 ${quantile(fresh, 0.95)}`);
    if (quantile(fresh, 0.05) < 0) problems.push(`fresh p5 ${quantile(fresh, 0.05)}`);
  }
  // FDA, same page: freezer at or below 0 °F (−17.8 °C), here near the unit's own setpoint.
  if (freezer.length > 0) {
    if (Math.abs(median(freezer) - profile.freezerSetpointC) > 3) problems.push(`freezer median ${median(freezer)}`);
    if (median(freezer) > -15) problems.push(`freezer median ${median(freezer)}`);
  }
  if (dutyCycle(trace) > 0.9) problems.push(`duty ${dutyCycle(trace).toFixed(2)}`);
  if (compressorStartsPerDay(trace) < 3) problems.push(`starts/day ${compressorStartsPerDay(trace).toFixed(1)}`);
  return problems;
}
