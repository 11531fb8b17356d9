import { IncidentTracker, type IncidentEvent } from '../../server/detection/incidents';
import { DEFAULT_SETTINGS } from '../../server/detection/settings';
import type { EngineEvent, Finding } from '../../server/detection/types';
import type { FindingKind } from '../../shared/domain';
import { HOUR_MS, run, simulate, START_MS } from './support/traces';

function finding(kind: FindingKind, startedH: number, detectedH: number, endedH: number | null = null): Finding {
  return {
    id: `${kind}:${startedH}`,
    kind,
    compartment: 'fresh_food',
    startedAtMs: START_MS + startedH * HOUR_MS,
    detectedAtMs: START_MS + detectedH * HOUR_MS,
    endedAtMs: endedH === null ? null : START_MS + endedH * HOUR_MS,
    severity: kind === 'sensor-fault' ? 'info' : 'urgent',
    probableCauses: kind === 'sensor-fault' ? [{ code: 'sensor', confidence: 1 }] : [{ code: 'evaporator-fan', confidence: 0.6 }],
    minutesAbove4c: 0,
    summary: '',
  };
}

const opened = (f: Finding): EngineEvent => ({ type: 'opened', atMs: f.detectedAtMs, finding: f });
const closed = (f: Finding, endedH: number): EngineEvent => {
  const ended = { ...f, endedAtMs: START_MS + endedH * HOUR_MS };
  return { type: 'closed', atMs: ended.endedAtMs!, finding: ended };
};

describe('IncidentTracker', () => {
  const reopenH = DEFAULT_SETTINGS.incidentReopenMinutes / 60;

  it('gathers the findings of one failure into one incident and closes it once recovered for the reopen window', () => {
    const tracker = new IncidentTracker();
    const trend = finding('warming-trend', 0, 1);
    const over = finding('over-temperature', 2, 3);
    const log: IncidentEvent[] = [];
    log.push(...tracker.handle(opened(trend)), ...tracker.handle(opened(over)));
    log.push(...tracker.handle(closed(trend, 8)), ...tracker.handle(closed(over, 9)));
    // It has recovered but not yet stayed recovered.
    expect(tracker.tick(START_MS + (9 + reopenH - 1) * HOUR_MS)).toEqual([]);
    const closing = tracker.tick(START_MS + (9 + reopenH) * HOUR_MS);
    expect(log.filter((e) => e.type === 'opened').length).toBe(1);
    expect(closing.length).toBe(1);
    expect(closing[0].incident.findingIds).toEqual([trend.id, over.id]);
    expect(closing[0].incident.closedAtMs).toBe(START_MS + 9 * HOUR_MS);
    expect(tracker.openIncidents()).toEqual([]);
  });

  it('rejoins trouble that returns inside the reopen window (hysteresis), and opens a new incident after it', () => {
    const tracker = new IncidentTracker();
    const first = finding('warming-trend', 0, 1);
    tracker.handle(opened(first));
    tracker.handle(closed(first, 5));
    const again = finding('over-temperature', 5 + reopenH / 2, 6 + reopenH / 2);
    const rejoin = tracker.handle(opened(again));
    expect(rejoin.map((e) => e.type)).toEqual(['updated']);
    tracker.handle(closed(again, 10 + reopenH / 2));
    const later = finding('warming-trend', 40 + reopenH, 41 + reopenH);
    const events = tracker.handle(opened(later));
    expect(events.map((e) => e.type)).toEqual(['closed', 'opened']);
  });

  it('keeps a sensor fault in its own incident (it never sends a technician to the appliance)', () => {
    const tracker = new IncidentTracker();
    tracker.handle(opened(finding('warming-trend', 0, 1)));
    const sensor = tracker.handle(opened(finding('sensor-fault', 2, 2)));
    expect(sensor[0].type).toBe('opened');
    expect(sensor[0].incident.lane).toBe('sensor');
    expect(tracker.openIncidents().map((i) => i.lane).sort()).toEqual(['repair', 'sensor']);
  });

  it('turns all the findings of a simulated compressor failure into one incident, surviving a snapshot', () => {
    const result = run(simulate({ style: 'top-freezer', days: 4, fault: 'compressor-start', onsetHours: 30, endHours: 60 }), 'top-freezer');
    let tracker = new IncidentTracker();
    const incidents = new Set<string>();
    result.events.forEach((event, index) => {
      if (index === 3) tracker = new IncidentTracker(undefined, JSON.parse(JSON.stringify(tracker.snapshot())));
      for (const e of tracker.handle(event)) incidents.add(e.incident.id);
    });
    expect(result.events.filter((e) => e.type === 'opened').length).toBeGreaterThan(2);
    expect(incidents.size).toBe(1);
  });
});
