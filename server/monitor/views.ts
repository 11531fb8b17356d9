import type { IncidentView } from '../../shared/api/monitor';
import type { CauseCode, FindingKind } from '../../shared/domain';

/** The most telling kind first: it names the incident in lists and e-mails. */
const KIND_ORDER: readonly FindingKind[] = ['power-loss', 'no-cooling', 'over-temperature', 'warming-trend', 'sensor-fault'];

export function incidentKindOf(kinds: readonly FindingKind[]): FindingKind {
  return KIND_ORDER.find((kind) => kinds.includes(kind)) ?? kinds[0] ?? 'sensor-fault';
}

const iso = (value: Date | null) => (value ? value.toISOString() : null);

/** The columns every incident query selects (alias i). */
export const INCIDENT_COLUMNS = `i.id, i.level, i.lane, i.kind, i.kinds, i.organization_id, i.property_id, i.unit_id, i.appliance_id, i.started_at, i.opened_at,
  i.closed_at, i.severity, i.top_cause, i.probable_causes, i.minutes_above_4c, i.property_incident_id, i.appliance_ids`;

export function incidentViewOf(row: Record<string, unknown>): IncidentView {
  return {
    id: row.id as string,
    level: row.level as IncidentView['level'],
    lane: row.lane as IncidentView['lane'],
    kind: row.kind as FindingKind,
    kinds: row.kinds as FindingKind[],
    organizationId: row.organization_id as string,
    propertyId: row.property_id as string,
    unitId: (row.unit_id as string | null) ?? null,
    applianceId: (row.appliance_id as string | null) ?? null,
    startedAt: (row.started_at as Date).toISOString(),
    openedAt: (row.opened_at as Date).toISOString(),
    closedAt: iso(row.closed_at as Date | null),
    severity: row.severity as IncidentView['severity'],
    topCause: (row.top_cause as CauseCode | null) ?? null,
    probableCauses: row.probable_causes as IncidentView['probableCauses'],
    minutesAbove4c: Number(row.minutes_above_4c),
    propertyIncidentId: (row.property_incident_id as string | null) ?? null,
    applianceIds: (row.appliance_ids as string[] | null) ?? [],
  };
}
