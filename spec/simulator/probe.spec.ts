/**
 * What the sensor reports: 12-bit steps, the probe's sentinel values, stuck and missing readings.
 * The probe modelled is the common DS18B20-type one-wire thermometer; its figures below are from
 * memory of that part's data sheet and the usual host libraries.
 */
import {
  ApplianceSimulator,
  DISCONNECTED_SENTINEL_C,
  POWER_ON_SENTINEL_C,
  PROBE_RESOLUTION_C,
  defaultProfile,
  generateTrace,
  quantizeProbeC,
} from '../../simulator/model';
import type { SimSample } from '../../simulator/model';
import { DAY_MS, HOUR_MS, MINUTE_MS, START_MS, between } from './trace-stats';

const FAULT_FROM_MS = START_MS + 6 * HOUR_MS;
const FAULT_TO_MS = START_MS + 12 * HOUR_MS;

function isTwelveBitStep(tempC: number): boolean {
  return Number.isInteger(tempC / PROBE_RESOLUTION_C);
}

function traceWithSensorFault(fault: 'sensor-disconnected' | 'sensor-power-on' | 'sensor-stuck' | 'sensor-dropout', probe?: 'fresh_food' | 'freezer'): SimSample[] {
  return generateTrace({
    profile: { ...defaultProfile('top-freezer'), lossProbability: 0 },
    seed: 9,
    startMs: START_MS,
    durationMs: DAY_MS,
    intervalMs: MINUTE_MS,
    faults: [{ fault, startMs: FAULT_FROM_MS, endMs: FAULT_TO_MS, probe }],
  });
}

describe('simulator: the probe', () => {
  it('reports only multiples of 0.0625 °C (12-bit resolution)', () => {
    // DS18B20-type data sheet (from memory): 12-bit conversions in steps of 0.0625 °C.
    expect(PROBE_RESOLUTION_C).toBe(0.0625);
    const trace = generateTrace({ profile: defaultProfile('side-by-side'), seed: 3, startMs: START_MS, durationMs: DAY_MS, intervalMs: MINUTE_MS });
    expect(trace.length).toBeGreaterThan(1000);
    for (const s of trace) {
      expect(isTwelveBitStep(s.freshFoodC!)).toBeTrue();
      expect(isTwelveBitStep(s.freezerC!)).toBeTrue();
    }
  });

  it('rounds to the nearest step and clamps to the probe range', () => {
    // Same data sheet: range −55..+125 °C.
    expect(quantizeProbeC(3.03)).toBe(3.0);
    expect(quantizeProbeC(3.04)).toBe(3.0625);
    expect(quantizeProbeC(-18.1)).toBe(-18.125);
    expect(quantizeProbeC(-80)).toBe(-55);
    expect(quantizeProbeC(200)).toBe(125);
  });

  it('reads −127 °C while disconnected, on the faulty probe only', () => {
    // −127 °C is what the usual host libraries report for a probe that does not answer (from memory).
    expect(DISCONNECTED_SENTINEL_C).toBe(-127);
    const trace = traceWithSensorFault('sensor-disconnected', 'freezer');
    const during = between(trace, FAULT_FROM_MS, FAULT_TO_MS);
    expect(during.every((s) => s.freezerC === -127)).toBeTrue();
    expect(during.every((s) => s.freshFoodC! > -5 && s.freshFoodC! < 15)).toBeTrue();
    expect(between(trace, FAULT_TO_MS, START_MS + DAY_MS).every((s) => s.freezerC! > -40)).toBeTrue();
  });

  it('reads 85 °C on a power-on reset', () => {
    // 85 °C is the DS18B20-type power-on value of the temperature register (data sheet, from memory).
    expect(POWER_ON_SENTINEL_C).toBe(85);
    const during = between(traceWithSensorFault('sensor-power-on'), FAULT_FROM_MS, FAULT_TO_MS);
    expect(during.length).toBeGreaterThan(300);
    expect(during.every((s) => s.freshFoodC === 85 && s.freezerC === 85)).toBeTrue();
  });

  it('repeats the last good value exactly while stuck', () => {
    const trace = traceWithSensorFault('sensor-stuck', 'fresh_food');
    const lastGood = between(trace, START_MS, FAULT_FROM_MS).at(-1)!;
    const during = between(trace, FAULT_FROM_MS, FAULT_TO_MS);
    expect(during.every((s) => s.freshFoodC === lastGood.freshFoodC)).toBeTrue();
    // The freezer probe keeps moving with the compressor cycle.
    expect(new Set(during.map((s) => s.freezerC)).size).toBeGreaterThan(10);
    // After the fault it moves again.
    expect(new Set(between(trace, FAULT_TO_MS, START_MS + DAY_MS).map((s) => s.freshFoodC)).size).toBeGreaterThan(3);
  });

  it('sends nothing during a dropout of the whole sensor', () => {
    const trace = traceWithSensorFault('sensor-dropout');
    expect(between(trace, FAULT_FROM_MS, FAULT_TO_MS).length).toBe(0);
    expect(between(trace, FAULT_TO_MS, START_MS + DAY_MS).length).toBe(12 * 60);
  });

  it('leaves one probe empty when only that probe drops out', () => {
    const during = between(traceWithSensorFault('sensor-dropout', 'fresh_food'), FAULT_FROM_MS, FAULT_TO_MS);
    expect(during.length).toBe(6 * 60);
    expect(during.every((s) => s.freshFoodC === null && s.freezerC !== null)).toBeTrue();
  });

  it('returns null from sample() during a dropout', () => {
    const sim = new ApplianceSimulator(defaultProfile(), { seed: 1, startMs: START_MS, faults: [{ fault: 'sensor-dropout', startMs: START_MS + HOUR_MS }] });
    sim.advanceTo(START_MS + 2 * HOUR_MS);
    expect(sim.sample()).toBeNull();
    sim.clearFault('sensor-dropout', START_MS + 2 * HOUR_MS);
    sim.advanceTo(START_MS + 2 * HOUR_MS + MINUTE_MS);
    expect(sim.sample()).not.toBeNull();
  });

  it('loses about the profile share of readings on the way', () => {
    const profile = { ...defaultProfile(), lossProbability: 0.02 };
    const expected = 7 * 24 * 60;
    const received = generateTrace({ profile, seed: 17, startMs: START_MS, durationMs: 7 * DAY_MS, intervalMs: MINUTE_MS }).length;
    const lostShare = 1 - received / expected;
    expect(lostShare).toBeGreaterThan(0.01);
    expect(lostShare).toBeLessThan(0.03);
  });

  it('has no fresh-food probe on a freezer and no freezer probe on a fresh-food-only unit', () => {
    const freezer = generateTrace({ profile: defaultProfile('chest-freezer'), seed: 1, startMs: START_MS, durationMs: HOUR_MS, intervalMs: MINUTE_MS });
    expect(freezer.every((s) => s.freshFoodC === null && s.freezerC !== null)).toBeTrue();
    const fresh = generateTrace({ profile: defaultProfile('fresh-food-only'), seed: 1, startMs: START_MS, durationMs: HOUR_MS, intervalMs: MINUTE_MS });
    expect(fresh.every((s) => s.freezerC === null && s.freshFoodC !== null)).toBeTrue();
  });

  it('reports a battery voltage that slowly falls', () => {
    const profile = { ...defaultProfile(), batteryStartV: 3.2, batteryDrainVPerYear: 0.3 };
    const trace = generateTrace({ profile, seed: 2, startMs: START_MS, durationMs: 180 * DAY_MS, intervalMs: DAY_MS, warmupMs: 0 });
    expect(trace[0].batteryV).toBeCloseTo(3.2, 1);
    expect(trace.at(-1)!.batteryV).toBeLessThan(trace[0].batteryV - 0.1);
  });
});
