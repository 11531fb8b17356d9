/**
 * Detection is causal (DESIGN.md, logger files): a finding's detected_at is the timestamp of
 * the reading at which the engine concluded it, using no reading after it; analysing the
 * input cut at that reading yields the same finding.
 */
import { analyzeReadings } from '../../server/detection/analyze';
import type { EngineReading, Finding } from '../../server/detection/types';
import type { ApplianceStyle } from '../../shared/domain';
import type { FaultCode } from '../../simulator/model';
import { simulate } from './support/traces';

const key = (f: Finding) => `${f.kind}|${f.compartment}|${f.startedAtMs}|${f.detectedAtMs}`;

function expectCausal(readings: EngineReading[], style: ApplianceStyle): number {
  const full = analyzeReadings(readings, style);
  for (const finding of full.findings) {
    const cut = readings.filter((r) => r.atMs <= finding.detectedAtMs);
    expect(cut[cut.length - 1].atMs).withContext('detected at a reading').toBe(finding.detectedAtMs);
    const again = analyzeReadings(cut, style).findings.map(key);
    expect(again).withContext(finding.id).toContain(key(finding));
  }
  return full.findings.length;
}

describe('causality: the cut-off replay yields every finding again', () => {
  const traces: [FaultCode, ApplianceStyle, number][] = [
    ['compressor-start', 'top-freezer', 3],
    ['evaporator-fan', 'bottom-freezer', 3],
    ['air-damper', 'bottom-freezer', 3],
    ['sensor-disconnected', 'upright-freezer', 3],
    ['power-loss', 'fresh-food-only', 3],
  ];
  for (const [fault, style, days] of traces) {
    it(`${fault} in a ${style}`, () => {
      const readings = simulate({ style, days, fault, onsetHours: 30, endHours: fault === 'power-loss' ? 40 : undefined, intervalMinutes: 10, severity: fault === 'sensor-disconnected' ? 0.5 : 1 });
      expect(expectCausal(readings, style)).toBeGreaterThan(0);
    });
  }
});
