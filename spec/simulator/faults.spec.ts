/**
 * Each mechanical fault against the signature the repair trade knows, always compared with the
 * same appliance, seed and days without the fault.
 */
import { ApplianceSimulator, defaultProfile, generateTrace } from '../../simulator/model';
import type { ApplianceProfile, FaultCode, SimSample } from '../../simulator/model';
import {
  DAY_MS,
  HOUR_MS,
  MINUTE_MS,
  START_MS,
  between,
  dutyCycle,
  freezerValues,
  freshValues,
  median,
  quantile,
} from './trace-stats';

const FAULT_AT_MS = START_MS + DAY_MS;

function traceWith(fault: FaultCode | null, days: number, profile: ApplianceProfile = defaultProfile(), severity = 1): SimSample[] {
  return generateTrace({
    profile,
    seed: 31,
    startMs: START_MS,
    durationMs: days * DAY_MS,
    intervalMs: 2 * MINUTE_MS,
    faults: fault ? [{ fault, startMs: FAULT_AT_MS, severity }] : [],
  });
}

/** Samples of one whole day, counted from the start of the trace. */
function day(trace: SimSample[], index: number): SimSample[] {
  return between(trace, START_MS + index * DAY_MS, START_MS + (index + 1) * DAY_MS);
}

describe('simulator: mechanical fault signatures', () => {
  const healthy = traceWith(null, 6);

  it('evaporator fan stopped: fresh food settles near 10 °C, freezer not cold enough, compressor runs on', () => {
    // Common practice of the trade: a stopped evaporator fan leaves the fresh-food section near
    // 10 °C (50 °F), typically 8–12 °C, the freezer at roughly −10..−5 °C.
    const lastDay = day(traceWith('evaporator-fan', 5), 4);
    expect(median(freshValues(lastDay))).toBeGreaterThan(8);
    expect(median(freshValues(lastDay))).toBeLessThan(12);
    expect(median(freezerValues(lastDay))).toBeGreaterThan(-12);
    expect(median(freezerValues(lastDay))).toBeLessThan(-3);
    expect(dutyCycle(lastDay)).toBeGreaterThan(0.9);
  });

  it('evaporator fan at half severity: warmer than healthy but better than stopped', () => {
    const half = median(freshValues(day(traceWith('evaporator-fan', 4, defaultProfile(), 0.5), 3)));
    const stopped = median(freshValues(day(traceWith('evaporator-fan', 4), 3)));
    expect(half).toBeLessThan(stopped - 1);
    expect(half).toBeGreaterThanOrEqual(median(freshValues(day(healthy, 3))) - 0.5);
  });

  it('compressor does not start: both compartments head for room temperature', () => {
    const trace = traceWith('compressor-start', 5);
    const lastDay = day(trace, 4);
    expect(lastDay.every((s) => !s.compressorOn)).toBeTrue();
    expect(median(freshValues(lastDay))).toBeGreaterThan(7);
    // Freezer food holds near its melting point for a long time, then warms on.
    expect(median(freezerValues(lastDay))).toBeGreaterThan(-3);
    expect(median(freezerValues(day(trace, 2)))).toBeGreaterThan(median(freezerValues(day(healthy, 2))) + 8);
  });

  it('condenser airflow blocked: cabinet drifts up a few degrees, compressor runs almost all the time', () => {
    // Common practice: capacity lost to a dirty coil or a stalled condenser fan (30–60 %); the hot
    // compressor runs on until its overload protector trips, rests a few minutes and restarts.
    const lastDay = day(traceWith('condenser-airflow', 5), 4);
    const healthyDay = day(healthy, 4);
    const driftK = median(freezerValues(lastDay)) - median(freezerValues(healthyDay));
    expect(driftK).toBeGreaterThan(2);
    expect(driftK).toBeLessThan(10);
    expect(dutyCycle(lastDay)).toBeGreaterThan(0.8);
    expect(dutyCycle(healthyDay)).toBeLessThan(0.75);
  });

  it('condenser airflow blocked is worse on a hot day, where a healthy unit holds', () => {
    // Common practice: a weak condenser shows most on hot days; a healthy unit has the margin.
    const hotDayRiseK = (faulty: boolean) => {
      const trace = generateTrace({
        profile: defaultProfile(),
        seed: 31,
        startMs: START_MS,
        durationMs: 3 * DAY_MS,
        intervalMs: 2 * MINUTE_MS,
        faults: faulty ? [{ fault: 'condenser-airflow', startMs: START_MS - DAY_MS }] : [],
        warmupMs: 2 * DAY_MS,
        extraEvents: [{ kind: 'hot-day', atMs: START_MS + DAY_MS, magnitude: 8 }],
      });
      const before = median(freezerValues(day(trace, 0)));
      const hot = median(freezerValues(between(trace, START_MS + DAY_MS + 6 * HOUR_MS, START_MS + 2 * DAY_MS - 3 * HOUR_MS)));
      return hot - before;
    };
    expect(hotDayRiseK(false)).toBeLessThan(1);
    expect(hotDayRiseK(true)).toBeGreaterThan(2);
  });

  it('air damper stuck closed: fresh food warms while the freezer gets colder', () => {
    const lastDay = day(traceWith('air-damper', 4), 3);
    const healthyDay = day(healthy, 3);
    expect(median(freshValues(lastDay))).toBeGreaterThan(median(freshValues(healthyDay)) + 3);
    expect(median(freezerValues(lastDay))).toBeLessThan(median(freezerValues(healthyDay)) - 2);
  });

  it('door seal torn: longer compressor runs, fresh food warmer after door use, freezer slightly warmer', () => {
    // Common practice: a leaking gasket lets room air in; the thermostat makes up for most of it
    // by running longer, what shows is the warm air after each opening and a slight drift.
    const lastDay = day(traceWith('door-seal', 4), 3);
    const healthyDay = day(healthy, 3);
    expect(dutyCycle(lastDay)).toBeGreaterThan(dutyCycle(healthyDay) + 0.15);
    expect(quantile(freshValues(lastDay), 0.99)).toBeGreaterThan(quantile(freshValues(healthyDay), 0.99) + 1);
    expect(Math.abs(median(freshValues(lastDay)) - median(freshValues(healthyDay)))).toBeLessThan(1);
    expect(median(freezerValues(lastDay))).toBeGreaterThanOrEqual(median(freezerValues(healthyDay)));
  });

  it('defrost system dead: fresh food creeps up over days, the freezer later, defrost rises vanish', () => {
    // Common practice: frost builds for days until air stops reaching the fresh-food section.
    const trace = traceWith('defrost-system', 12);
    const healthyFresh = median(freshValues(day(healthy, 1)));
    const freshByDay = [1, 2, 3, 4, 5, 6].map((d) => median(freshValues(day(trace, d))));
    expect(freshByDay[0]).toBeLessThan(healthyFresh + 0.5);
    // Between one and four days after the fault the fresh-food section has crept up.
    expect(Math.max(...freshByDay.slice(1, 5))).toBeGreaterThan(healthyFresh + 3);
    const freezerEarly = median(freezerValues(day(trace, 3)));
    const freezerLate = median(freezerValues(day(trace, 11)));
    expect(freezerEarly).toBeLessThan(-16);
    expect(freezerLate).toBeGreaterThan(freezerEarly + 3);
  });

  it('power lost: both compartments warm and recover once power returns', () => {
    const profile = { ...defaultProfile(), doorOpeningsPerDay: 0 };
    const trace = generateTrace({
      profile,
      seed: 31,
      startMs: START_MS,
      durationMs: 3 * DAY_MS,
      intervalMs: 2 * MINUTE_MS,
      faults: [{ fault: 'power-loss', startMs: START_MS + 6 * 3_600_000, endMs: START_MS + 30 * 3_600_000 }],
    });
    const outage = between(trace, START_MS + 6 * 3_600_000, START_MS + 30 * 3_600_000);
    expect(outage.every((s) => !s.compressorOn)).toBeTrue();
    expect(outage[outage.length - 1].freshFoodC!).toBeGreaterThan(6);
    expect(outage[outage.length - 1].freezerC!).toBeGreaterThan(-10);
    const recovered = day(trace, 2);
    expect(median(freshValues(recovered))).toBeLessThan(5);
    expect(median(freezerValues(recovered))).toBeLessThan(-15);
  });

  it('takes faults injected and cleared while running', () => {
    const sim = new ApplianceSimulator(defaultProfile(), { seed: 5, startMs: START_MS });
    sim.advanceTo(START_MS + DAY_MS);
    const healthyC = sim.truth().freshFoodC;
    sim.injectFault({ fault: 'compressor-start', startMs: sim.nowMs });
    sim.advanceTo(START_MS + 2 * DAY_MS);
    expect(sim.sample()?.compressorOn ?? false).toBeFalse();
    expect(sim.truth().freshFoodC).toBeGreaterThan(healthyC + 3);
    sim.clearFault('compressor-start', sim.nowMs);
    sim.advanceTo(START_MS + 3 * DAY_MS);
    expect(sim.truth().freshFoodC).toBeLessThan(healthyC + 1);
  });
});
