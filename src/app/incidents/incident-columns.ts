import { INCIDENT_SORTS, type IncidentListItem } from '../../../shared/api/monitor';
import { COLUMN_LABELS, INCIDENT_COLUMNS, type IncidentColumn } from '../../../shared/api/tables';
import { FRESH_FOOD_LIMIT_C, formatTemperature, type TemperatureUnit } from '../../../shared/temperature';
import { KIND_LABELS, SEVERITY_LABELS } from '../fleet/appliance-words';
import { formatZoned } from '../fleet/zoned-date';
import type { TableColumn } from '../shared/data-table/table-types';
import { causeTitle, severityTone } from '../shared/data-table/table-words';

const sortable = (id: IncidentColumn) => ((INCIDENT_SORTS as readonly string[]).includes(id) ? id : undefined);

/** The incident table's columns; dates in the property's zone, the limit in the user's unit. */
export function incidentColumns(unit: TemperatureUnit): TableColumn<IncidentListItem>[] {
  const text: Record<IncidentColumn, (i: IncidentListItem) => string> = {
    openedAt: (i) => formatZoned(i.openedAt, i.place.timeZone, 'date-time'),
    property: (i) => i.place.propertyName,
    unit: (i) => i.place.unitLabel ?? 'whole property',
    appliance: (i) => i.place.applianceLabel ?? (i.level === 'property' ? `${i.applianceIds.length} appliances` : '—'),
    kind: (i) => KIND_LABELS[i.kind],
    severity: (i) => SEVERITY_LABELS[i.severity],
    topCause: (i) => causeTitle(i.topCause),
    minutesAbove4c: (i) => `${i.minutesAbove4c} min`,
    status: (i) => (i.closedAt ? 'closed' : 'open'),
    closedAt: (i) => formatZoned(i.closedAt, i.place.timeZone, 'date-time'),
  };
  const labels: Partial<Record<IncidentColumn, string>> = { minutesAbove4c: `Time above ${formatTemperature(FRESH_FOOD_LIMIT_C, unit, 0)}` };
  return INCIDENT_COLUMNS.map((id) => ({
    id,
    label: labels[id] ?? COLUMN_LABELS[id],
    text: text[id],
    sortKey: sortable(id),
    tone: id === 'severity' ? (i: IncidentListItem) => severityTone(i.severity) : id === 'status' ? (i: IncidentListItem) => (i.closedAt ? 'done' : null) : undefined,
  }));
}
