import type { LiveEvent } from '../../../shared/api/live';
import type { IncidentView } from '../../../shared/api/monitor';
import { sampleOverview } from './fleet-fixtures';
import { applyLiveEvent } from './fleet-live';

const place = { organizationId: 'o1', propertyId: 'p-birch', unitId: 'u-3c', applianceId: 'a-3c' };

function incident(extra: Partial<IncidentView>): IncidentView {
  return {
    id: 'i-new', level: 'appliance', lane: 'repair', kind: 'no-cooling', kinds: ['no-cooling'], organizationId: 'o1', propertyId: 'p-birch', unitId: 'u-3c', applianceId: 'a-3c',
    startedAt: '2026-03-02T14:00:00.000Z', openedAt: '2026-03-02T14:30:00.000Z', closedAt: null, severity: 'critical', topCause: 'compressor-start',
    probableCauses: [{ code: 'compressor-start', confidence: 0.8 }], minutesAbove4c: 0, propertyIncidentId: null, applianceIds: [], ...extra,
  };
}

describe('applyLiveEvent', () => {
  it('recolours the tile and moves one appliance between the counts', () => {
    const before = sampleOverview();
    const event: LiveEvent = { type: 'appliance.health-changed', ...place, atMs: Date.parse('2026-03-02T15:01:00Z'), health: 'no-cooling', previous: 'cold' };
    const after = applyLiveEvent(before, event)!;
    const tile = after.properties[1]!.units[0]!.appliances[0]!;
    expect(tile.health).toBe('no-cooling');
    expect(tile.healthSince).toBe('2026-03-02T15:01:00.000Z');
    expect(after.counts.cold).toBe(before.counts.cold - 1);
    expect(after.counts['no-cooling']).toBe(before.counts['no-cooling'] + 1);
    expect(after.properties[1]!.counts).toEqual({ cold: 0, drifting: 0, warm: 0, 'no-cooling': 1, silent: 1 });
    expect(before.properties[1]!.units[0]!.appliances[0]!.health).toBe('cold'); // the old overview is untouched
  });

  it('shows a new incident on the tile and takes it off when it closes', () => {
    const opened = applyLiveEvent(sampleOverview(), { type: 'incident.opened', ...place, atMs: 1, incident: incident({}) })!;
    expect(opened.properties[1]!.units[0]!.appliances[0]!.openIncident).toEqual(jasmine.objectContaining({ id: 'i-new', severity: 'critical', topCause: 'compressor-start', openCount: 1 }));
    const closed = applyLiveEvent(opened, { type: 'incident.closed', ...place, atMs: 2, incident: incident({ closedAt: '2026-03-02T18:00:00.000Z' }) })!;
    expect(closed.properties[1]!.units[0]!.appliances[0]!.openIncident).toBeNull();
  });

  it('keeps a worse incident already shown and counts the new one', () => {
    const event: LiveEvent = { type: 'incident.opened', ...place, propertyId: 'p-alder', unitId: 'u-1a', applianceId: 'a-1a', atMs: 1, incident: incident({ id: 'i-minor', severity: 'watch', applianceId: 'a-1a' }) };
    const after = applyLiveEvent(sampleOverview(), event)!;
    expect(after.properties[0]!.units[0]!.appliances[0]!.openIncident).toEqual(jasmine.objectContaining({ id: 'i-1', severity: 'urgent', openCount: 2 }));
  });

  it('ignores events about appliances not shown and events with nothing for a tile', () => {
    expect(applyLiveEvent(sampleOverview(), { type: 'appliance.health-changed', ...place, applianceId: 'elsewhere', atMs: 1, health: 'warm', previous: 'cold' })).toBeNull();
    expect(applyLiveEvent(sampleOverview(), { type: 'work-order.changed', ...place, atMs: 1, workOrderId: 'w', serviceRequestId: 's', contractorId: null, state: 'accepted', change: 'accepted' })).toBeNull();
  });
});
