import type { EngineReading } from '../../server/detection/types';
import { HOUR_MS, MINUTE_MS, repairFindings, run, signal, simulate, START_MS } from './support/traces';

const between = (atMs: number, fromH: number, toH: number) => atMs >= START_MS + fromH * HOUR_MS && atMs < START_MS + toH * HOUR_MS;

function withFreezer(readings: EngineReading[], value: (r: EngineReading) => number | null): EngineReading[] {
  return readings.map((r) => ({ ...r, freezerC: value(r) }));
}

describe('sensor faults (hand-built)', () => {
  const base = signal({ hours: 40 });

  // −127 °C and 85 °C are the codes one-wire digital probes report when disconnected and
  // before their first conversion after power-on (common practice of sensor builders).
  for (const [code, reason] of [[-127, 'disconnected'], [85, 'power-on']] as const) {
    it(`recognises the ${code} °C code as a sensor fault, never as a temperature`, () => {
      const result = run(withFreezer(base, (r) => (between(r.atMs, 26, 28) ? code : r.freezerC)), 'top-freezer');
      const faults = result.findings.filter((f) => f.kind === 'sensor-fault');
      expect(faults.length).toBe(1);
      expect(faults[0].compartment).toBe('freezer');
      expect(faults[0].probableCauses).toEqual([{ code: 'sensor', confidence: 1 }]);
      expect(faults[0].summary).toContain(reason === 'disconnected' ? 'disconnected' : 'power-on');
      expect(faults[0].endedAtMs).not.toBeNull();
      expect(repairFindings(result)).toEqual([]);
    });
  }

  it('recognises a stuck value after four hours of identical readings', () => {
    const result = run(withFreezer(base, (r) => (between(r.atMs, 26, 33) ? -19.0625 : r.freezerC)), 'top-freezer');
    const fault = result.findings.find((f) => f.kind === 'sensor-fault');
    expect(fault).toBeDefined();
    expect(fault!.summary).toContain('same value');
    expect(fault!.startedAtMs).toBe(START_MS + 26 * HOUR_MS);
    expect(fault!.detectedAtMs - fault!.startedAtMs).toBeGreaterThanOrEqual(4 * HOUR_MS);
    expect(repairFindings(result)).toEqual([]);
  });

  it('recognises a probe that stops reporting while the other goes on', () => {
    const readings = base.map((r) => ({ ...r, freshFoodC: between(r.atMs, 26, 29) ? null : r.freshFoodC }));
    const fault = run(readings, 'top-freezer').findings.find((f) => f.kind === 'sensor-fault');
    expect(fault?.compartment).toBe('fresh_food');
    expect(fault!.detectedAtMs - (START_MS + 26 * HOUR_MS)).toBeGreaterThanOrEqual(60 * MINUTE_MS - 5 * MINUTE_MS);
  });

  it('recognises impossible jumps (three single-reading spikes in a day) and ignores their values', () => {
    const spikes = [27, 30, 33].map((h) => START_MS + h * HOUR_MS);
    const result = run(withFreezer(base, (r) => (spikes.includes(r.atMs) ? 25 : r.freezerC)), 'top-freezer');
    expect(result.findings.some((f) => f.kind === 'sensor-fault' && f.summary.includes('jumps'))).toBeTrue();
    expect(repairFindings(result)).toEqual([]);
  });

  it('says silent when every probe has stopped', () => {
    const readings = base.map((r) => (between(r.atMs, 30, 40) ? { ...r, freshFoodC: null, freezerC: null } : r));
    expect(run(readings, 'top-freezer').engine.health()).toBe('silent');
  });
});

describe('simulated sensor faults raise only a sensor fault (no dispatch)', () => {
  for (const fault of ['sensor-disconnected', 'sensor-power-on', 'sensor-stuck', 'sensor-dropout'] as const) {
    for (const probe of ['fresh_food', 'freezer'] as const) {
      it(`${fault} on the ${probe} probe`, () => {
        const readings = simulate({ style: 'bottom-freezer', days: 3, fault, probe, onsetHours: 36, severity: fault === 'sensor-dropout' || fault === 'sensor-stuck' ? 1 : 0.5 });
        const result = run(readings, 'bottom-freezer');
        expect(repairFindings(result)).toEqual([]);
        const sensor = result.findings.filter((f) => f.kind === 'sensor-fault');
        expect(sensor.length).toBeGreaterThanOrEqual(1);
        expect(sensor.every((f) => f.compartment === probe)).toBeTrue();
      });
    }
  }
});
