/**
 * Trade signatures (common practice of the repair trade, no published source), checked on
 * the simulator's textbook faults (default profiles, 5-minute readings, severity 1).
 */
import { APPLIANCE_STYLES, type ApplianceStyle, type CauseCode } from '../../shared/domain';
import type { FaultCode } from '../../simulator/model';
import { causesAtVisit, DAY_MS, firstRepair, HOUR_MS, repairFindings, run, simulate, START_MS, topCause } from './support/traces';

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1];
}

describe('trade signatures', () => {
  it('a stopped evaporator fan leaves the fresh food near 10 °C and the freezer not cold enough, and is diagnosed evaporator-fan', () => {
    const readings = simulate({ style: 'top-freezer', days: 4, fault: 'evaporator-fan', onsetHours: 30 });
    const lastDay = readings.filter((r) => r.atMs >= START_MS + 3 * DAY_MS);
    // Common practice: fresh food settles near 10 °C (50 °F); the freezer is well above 0 °F.
    expect(median(lastDay.map((r) => r.freshFoodC!))).toBeGreaterThan(8);
    expect(median(lastDay.map((r) => r.freshFoodC!))).toBeLessThan(12);
    expect(median(lastDay.map((r) => r.freezerC!))).toBeGreaterThan(-14);
    const result = run(readings, 'top-freezer');
    const first = firstRepair(result)!;
    expect(first.detectedAtMs).toBeGreaterThan(START_MS + 30 * HOUR_MS);
    expect(topCause(causesAtVisit(result))).toBe('evaporator-fan');
  });

  const cases: [FaultCode, ApplianceStyle, number, CauseCode][] = [
    ['evaporator-fan', 'bottom-freezer', 3, 'evaporator-fan'],
    ['compressor-start', 'top-freezer', 3, 'compressor-start'],
    ['compressor-start', 'chest-freezer', 3, 'compressor-start'],
    ['air-damper', 'bottom-freezer', 3, 'air-damper'],
    ['condenser-airflow', 'side-by-side', 4, 'condenser-airflow'],
    ['door-seal', 'bottom-freezer', 3, 'door-seal'],
    ['defrost-system', 'upright-freezer', 12, 'defrost-system'],
  ];
  for (const [fault, style, days, cause] of cases) {
    it(`a ${fault} fault in a ${style} is diagnosed ${cause} by the time a technician arrives`, () => {
      const result = run(simulate({ style, days, fault, onsetHours: 30 }), style);
      const first = firstRepair(result);
      expect(first).withContext('detected').toBeDefined();
      expect(first!.detectedAtMs).toBeGreaterThan(START_MS + 30 * HOUR_MS);
      expect(topCause(causesAtVisit(result))).toBe(cause);
    });
  }

  it('a dead compressor is diagnosed at once: the freezer climbs while the running fan keeps the fresh food cool', () => {
    const result = run(simulate({ style: 'side-by-side', days: 3, fault: 'compressor-start', onsetHours: 30 }), 'side-by-side');
    const first = firstRepair(result)!;
    expect(first.detectedAtMs - (START_MS + 30 * HOUR_MS)).toBeLessThan(3 * HOUR_MS);
    expect(topCause(first.probableCauses)).toBe('compressor-start');
    expect(result.findings.some((f) => f.kind === 'no-cooling' && f.compartment === 'both')).toBeTrue();
  });
});

describe('normal operation raises no repair finding', () => {
  // A week with automatic defrost, door openings, two warm grocery loads and a hot day.
  for (const style of APPLIANCE_STYLES) {
    it(`a healthy ${style} week`, () => {
      const readings = simulate({
        style,
        days: 7,
        seed: 11,
        extraEvents: [
          { kind: 'grocery-load', atMs: START_MS + 2.4 * DAY_MS, magnitude: 10 },
          { kind: 'hot-day', atMs: START_MS + 3.5 * DAY_MS, magnitude: 8 },
          { kind: 'grocery-load', atMs: START_MS + 5.7 * DAY_MS, magnitude: 6 },
        ],
      });
      const result = run(readings, style);
      expect(repairFindings(result).map((f) => `${f.kind} ${f.compartment}`)).toEqual([]);
      expect(result.findings).toEqual([]);
    });
  }
});
