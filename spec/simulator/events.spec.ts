/**
 * Optional events of ordinary life: a warm grocery load and a hot day.
 */
import { ApplianceSimulator, defaultProfile, generateTrace } from '../../simulator/model';
import { DAY_MS, HOUR_MS, MINUTE_MS, START_MS, between, dutyCycle, freshValues, quantile } from './trace-stats';

describe('simulator: grocery load', () => {
  const profile = { ...defaultProfile('top-freezer'), doorOpeningsPerDay: 0 };
  const loadAtMs = START_MS + 12 * HOUR_MS;

  function foodCurve(withLoad: boolean): { atMs: number; foodC: number; readingC: number | null; compressorOn: boolean }[] {
    const sim = new ApplianceSimulator(profile, {
      seed: 4,
      startMs: START_MS,
      extraEvents: withLoad ? [{ kind: 'grocery-load', atMs: loadAtMs, magnitude: 8 }] : [],
    });
    const curve = [];
    for (let atMs = loadAtMs - HOUR_MS; atMs <= loadAtMs + 5 * HOUR_MS; atMs += MINUTE_MS) {
      sim.advanceTo(atMs);
      const s = sim.sample();
      curve.push({ atMs, foodC: sim.truth().freshFoodC, readingC: s?.freshFoodC ?? null, compressorOn: s?.compressorOn ?? false });
    }
    return curve;
  }

  const loaded = foodCurve(true);
  const plain = foodCurve(false);
  const beforeC = loaded.find((p) => p.atMs === loadAtMs)!.foodC;

  it('warms the food and recovers over an hour or two', () => {
    // Common practice: a bag of groceries at shop temperature is pulled down within 1–3 hours.
    const peakC = Math.max(...loaded.filter((p) => p.atMs > loadAtMs).map((p) => p.foodC));
    expect(peakC - beforeC).toBeGreaterThan(0.8);
    const recovered = loaded.find((p) => p.atMs > loadAtMs && p.foodC < beforeC + 0.3)!;
    const recoveryH = (recovered.atMs - loadAtMs) / HOUR_MS;
    expect(recoveryH).toBeGreaterThan(0.75);
    expect(recoveryH).toBeLessThan(3.5);
  });

  it('shows the long door opening on the probe and makes the compressor work harder', () => {
    const readingAtLoad = loaded.find((p) => p.atMs === loadAtMs + MINUTE_MS)!.readingC!;
    expect(readingAtLoad).toBeGreaterThan(plain.find((p) => p.atMs === loadAtMs + MINUTE_MS)!.readingC! + 3);
    const runMinutes = (curve: typeof loaded) => curve.filter((p) => p.atMs > loadAtMs && p.atMs < loadAtMs + 2 * HOUR_MS && p.compressorOn).length;
    expect(runMinutes(loaded)).toBeGreaterThan(runMinutes(plain) + 10);
  });
});

describe('simulator: hot day', () => {
  const profile = defaultProfile('top-freezer');
  const hotAtMs = START_MS + DAY_MS;

  it('raises the room by the given amount for a day', () => {
    const sim = new ApplianceSimulator(profile, { seed: 2, startMs: START_MS, extraEvents: [{ kind: 'hot-day', atMs: hotAtMs, magnitude: 8 }] });
    const plain = new ApplianceSimulator(profile, { seed: 2, startMs: START_MS });
    const middayMs = hotAtMs + 12 * HOUR_MS;
    sim.advanceTo(middayMs);
    plain.advanceTo(middayMs);
    expect(sim.truth().roomC - plain.truth().roomC).toBeCloseTo(8, 5);
    sim.advanceTo(hotAtMs + 2 * DAY_MS);
    plain.advanceTo(hotAtMs + 2 * DAY_MS);
    expect(sim.truth().roomC).toBeCloseTo(plain.truth().roomC, 5);
  });

  it('makes a healthy unit run longer while keeping food cold', () => {
    const options = { profile, seed: 2, startMs: START_MS, durationMs: 3 * DAY_MS, intervalMs: 2 * MINUTE_MS };
    const hot = generateTrace({ ...options, extraEvents: [{ kind: 'hot-day', atMs: hotAtMs, magnitude: 8 }] });
    const plain = generateTrace(options);
    const hotHours = (t: typeof hot) => between(t, hotAtMs + 3 * HOUR_MS, hotAtMs + DAY_MS - 3 * HOUR_MS);
    expect(dutyCycle(hotHours(hot))).toBeGreaterThan(dutyCycle(hotHours(plain)) + 0.1);
    // FDA, "Refrigerator Thermometers: Cold Facts about Food Safety": at or below 4.4 °C.
    expect(quantile(freshValues(hotHours(hot)), 0.9)).toBeLessThan(4.4);
  });
});
