import { REQUEST_SORTS, type ServiceRequestView } from '../../../shared/api/service-requests';
import { COLUMN_LABELS, REQUEST_COLUMNS, type RequestColumn } from '../../../shared/api/tables';
import { formatZoned } from '../fleet/zoned-date';
import type { TableColumn } from '../shared/data-table/table-types';
import { PRIORITY_LABELS, REQUEST_SOURCE_LABELS, REQUEST_STATUS_LABELS } from '../shared/data-table/table-words';

const TEXT: Record<RequestColumn, (r: ServiceRequestView) => string> = {
  openedAt: (r) => formatZoned(r.openedAt, r.place.timeZone, 'date-time'),
  title: (r) => r.title,
  property: (r) => r.place.propertyName,
  unit: (r) => r.place.unitLabel ?? 'whole property',
  appliance: (r) => r.place.applianceLabel ?? '—',
  source: (r) => REQUEST_SOURCE_LABELS[r.source],
  priority: (r) => PRIORITY_LABELS[r.priority],
  status: (r) => REQUEST_STATUS_LABELS[r.status],
  progress: (r) => r.progress,
  contractor: (r) => r.workOrder?.contractorName ?? '—',
  closedAt: (r) => formatZoned(r.closedAt, r.place.timeZone, 'date-time'),
};

const TONES: Partial<Record<RequestColumn, (r: ServiceRequestView) => string | null>> = {
  priority: (r) => (r.priority === 'urgent' ? 'urgent' : null),
  status: (r) => (r.status === 'open' ? null : 'done'),
};

/** The request table's columns, dates in the property's own zone. */
export const REQUEST_TABLE_COLUMNS: TableColumn<ServiceRequestView>[] = REQUEST_COLUMNS.map((id) => ({
  id,
  label: COLUMN_LABELS[id],
  text: TEXT[id],
  sortKey: (REQUEST_SORTS as readonly string[]).includes(id) ? id : undefined,
  tone: TONES[id],
}));
