import type { Health } from '../../shared/domain';
import { isRepairFinding } from '../detection/types';
import type { FindingWrite, IncidentWrite } from './monitor-store';
import type { FeedResult, MonitoredAppliance } from './monitored-appliance';

export type IncidentChange = 'opened' | 'updated' | 'closed';

export interface HealthChange {
  appliance: MonitoredAppliance;
  previous: Health | null;
}

/**
 * What one batch changed, with repeats folded: a finding updated ten times in a batch is
 * written once, in its last state; an incident remembers whether it opened or closed.
 */
export class BatchChanges {
  readonly findings = new Map<string, FindingWrite>();
  readonly incidents = new Map<string, IncidentWrite & { changes: Set<IncidentChange> }>();
  readonly health: HealthChange[] = [];
  readonly touched: MonitoredAppliance[] = [];
  /** Properties where a repair finding opened, changed or closed: the power-loss check runs there. */
  readonly propertiesToCorrelate = new Set<string>();

  take(appliance: MonitoredAppliance, fed: FeedResult): void {
    const ref = appliance.ref;
    this.touched.push(appliance);
    for (const event of fed.engineEvents) {
      this.findings.set(`${ref.applianceId}|${event.finding.id}`, { ref, finding: event.finding });
      if (isRepairFinding(event.finding)) this.propertiesToCorrelate.add(ref.propertyId);
    }
    for (const event of fed.incidentEvents) {
      const key = `${ref.applianceId}|${event.incident.id}`;
      const entry = this.incidents.get(key) ?? { ref, incident: event.incident, changes: new Set<IncidentChange>() };
      entry.incident = event.incident;
      entry.changes.add(event.type);
      this.incidents.set(key, entry);
    }
  }

  noteHealth(appliance: MonitoredAppliance, previous: Health | null): void {
    this.health.push({ appliance, previous });
  }
}

/** The events one incident's changes in a batch turn into, in order. */
export function incidentEventTypes(changes: Set<IncidentChange>): IncidentChange[] {
  const types: IncidentChange[] = [];
  if (changes.has('opened')) types.push('opened');
  if (changes.has('closed')) types.push('closed');
  if (!types.length) types.push('updated');
  return types;
}
