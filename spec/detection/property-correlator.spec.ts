import { PropertyCorrelator, type ApplianceFinding } from '../../server/detection/property-correlator';
import type { Finding } from '../../server/detection/types';
import type { ApplianceStyle } from '../../shared/domain';
import { HOUR_MS, MINUTE_MS, run, simulate, START_MS } from './support/traces';

function unitFinding(applianceId: string, startedMinutes: number, detectedMinutes: number, kind: Finding['kind'] = 'warming-trend'): ApplianceFinding {
  return {
    applianceId,
    finding: {
      id: `${applianceId}:${kind}:${startedMinutes}`,
      kind,
      compartment: 'fresh_food',
      startedAtMs: START_MS + startedMinutes * MINUTE_MS,
      detectedAtMs: START_MS + detectedMinutes * MINUTE_MS,
      endedAtMs: null,
      severity: 'urgent',
      probableCauses: [{ code: 'compressor-start', confidence: 0.5 }],
      minutesAbove4c: 30,
      summary: '',
    },
  };
}

describe('PropertyCorrelator', () => {
  const correlator = new PropertyCorrelator();

  it('turns many units warming together into one property-level power-loss finding', () => {
    const findings = ['a', 'b', 'c', 'd'].map((id, i) => unitFinding(id, 10 * i, 100 + 20 * i));
    const episodes = correlator.correlate('property-1', findings, 6);
    expect(episodes.length).toBe(1);
    const { finding, applianceIds, absorbedFindingIds } = episodes[0];
    expect(finding.kind).toBe('power-loss');
    expect(finding.compartment).toBe('both');
    expect(finding.probableCauses[0].code).toBe('power-loss');
    expect(applianceIds).toEqual(['a', 'b', 'c', 'd']);
    expect(absorbedFindingIds.length).toBe(4);
    // Causal: concluded when the third unit (max(3, half of 6)) had its own finding.
    expect(finding.detectedAtMs).toBe(START_MS + 140 * MINUTE_MS);
  });

  it('does not correlate units that start warming hours apart, or too few of a large property', () => {
    const apart = ['a', 'b', 'c'].map((id, i) => unitFinding(id, 300 * i, 300 * i + 60));
    expect(correlator.correlate('p', apart, 3)).toEqual([]);
    const few = ['a', 'b', 'c'].map((id) => unitFinding(id, 0, 60));
    expect(correlator.correlate('p', few, 10)).toEqual([]);
  });

  it('ignores sensor faults', () => {
    const sensors = ['a', 'b', 'c'].map((id) => unitFinding(id, 0, 5, 'sensor-fault'));
    expect(correlator.correlate('p', sensors, 3)).toEqual([]);
  });

  it('finds a simulated outage of four units and calls it critical past 4 hours (USDA FSIS: a closed refrigerator keeps food safe about 4 hours)', () => {
    const styles: ApplianceStyle[] = ['top-freezer', 'bottom-freezer', 'side-by-side', 'upright-freezer'];
    const findings = styles.flatMap((style, i) =>
      run(simulate({ style, days: 3, seed: 20 + i, fault: 'power-loss', onsetHours: 36, endHours: 44 }), style).findings.map((finding) => ({ applianceId: `unit-${i}`, finding })),
    );
    const episodes = correlator.correlate('property-2', findings, 4);
    expect(episodes.length).toBe(1);
    const episode = episodes[0].finding;
    expect(Math.abs(episode.startedAtMs - (START_MS + 36 * HOUR_MS))).toBeLessThan(2 * HOUR_MS);
    expect(episode.detectedAtMs).toBeGreaterThan(START_MS + 36 * HOUR_MS);
    expect(episode.severity).toBe('critical');
  });
});
