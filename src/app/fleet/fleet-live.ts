/**
 * A live event applied to the fleet overview on screen, at once, before the page reloads
 * the overview for exact counts. Returns null when the event concerns no tile shown.
 */
import type { FleetAppliance, FleetIncidentSummary, FleetOverview } from '../../../shared/api/fleet';
import type { LiveEvent } from '../../../shared/api/live';
import { SEVERITIES } from '../../../shared/domain';

type Patch = (appliance: FleetAppliance) => FleetAppliance;

function incidentPatch(event: Extract<LiveEvent, { type: 'incident.opened' | 'incident.updated' | 'incident.closed' }>): Patch {
  const incident = event.incident;
  return (appliance) => {
    const current = appliance.openIncident;
    if (incident.closedAt !== null) return current?.id === incident.id ? { ...appliance, openIncident: null } : appliance;
    const summary: FleetIncidentSummary = {
      id: incident.id,
      kind: incident.kind,
      severity: incident.severity,
      topCause: incident.topCause,
      openedAt: incident.openedAt,
      openCount: current && current.id !== incident.id ? current.openCount + 1 : (current?.openCount ?? 1),
    };
    const keepCurrent = current && current.id !== incident.id && SEVERITIES.indexOf(current.severity) > SEVERITIES.indexOf(incident.severity);
    return keepCurrent ? { ...appliance, openIncident: { ...current, openCount: summary.openCount } } : { ...appliance, openIncident: summary };
  };
}

function patchOf(event: LiveEvent): Patch | null {
  switch (event.type) {
    case 'appliance.health-changed':
      return (appliance) => ({ ...appliance, health: event.health, healthSince: new Date(event.atMs).toISOString() });
    case 'incident.opened':
    case 'incident.updated':
    case 'incident.closed':
      return event.incident.level === 'appliance' ? incidentPatch(event) : null;
    default:
      return null;
  }
}

export function applyLiveEvent(overview: FleetOverview, event: LiveEvent): FleetOverview | null {
  const patch = patchOf(event);
  if (!patch || !event.applianceId) return null;
  const propertyIndex = overview.properties.findIndex((p) => p.id === event.propertyId);
  const property = overview.properties[propertyIndex];
  const unitIndex = property?.units.findIndex((u) => u.appliances.some((a) => a.id === event.applianceId)) ?? -1;
  if (!property || unitIndex < 0) return null;
  const unit = property.units[unitIndex]!;
  const before = unit.appliances.find((a) => a.id === event.applianceId)!;
  const after = patch(before);
  const counts = { ...overview.counts };
  const propertyCounts = { ...property.counts };
  if (after.health !== before.health) {
    for (const tally of [counts, propertyCounts]) {
      tally[before.health] = Math.max(0, tally[before.health] - 1);
      tally[after.health] += 1;
    }
  }
  const units = property.units.map((u, i) => (i === unitIndex ? { ...u, appliances: u.appliances.map((a) => (a.id === before.id ? after : a)) } : u));
  const properties = overview.properties.map((p, i) => (i === propertyIndex ? { ...p, counts: propertyCounts, units } : p));
  return { ...overview, counts, properties };
}
