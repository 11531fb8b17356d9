import { COLUMN_LABELS, WORK_ORDER_COLUMNS, type WorkOrderColumn } from '../../../shared/api/tables';
import { WORK_ORDER_SORTS, type WorkOrderSummary } from '../../../shared/api/work-orders';
import { formatZoned } from '../fleet/zoned-date';
import type { TableColumn } from '../shared/data-table/table-types';
import { PRIORITY_LABELS, WORK_ORDER_STATE_LABELS } from '../shared/data-table/table-words';

const zone = (w: WorkOrderSummary) => w.property.timeZone;

const TEXT: Record<WorkOrderColumn, (w: WorkOrderSummary) => string> = {
  dueAt: (w) => formatZoned(w.dueAt, zone(w), 'date-time'),
  title: (w) => w.title,
  property: (w) => w.property.name,
  unit: (w) => w.unit?.label ?? 'whole property',
  contractor: (w) => w.contractor.name,
  priority: (w) => PRIORITY_LABELS[w.priority],
  state: (w) => WORK_ORDER_STATE_LABELS[w.state],
  overdue: (w) => (w.overdue ? 'overdue' : 'on time'),
  dispatchedAt: (w) => formatZoned(w.dispatchedAt, zone(w), 'date-time'),
  scheduledStartAt: (w) => formatZoned(w.scheduledStartAt, zone(w), 'date-time'),
};

const TONES: Partial<Record<WorkOrderColumn, (w: WorkOrderSummary) => string | null>> = {
  priority: (w) => (w.priority === 'urgent' ? 'urgent' : null),
  overdue: (w) => (w.overdue ? 'overdue' : null),
  state: (w) => (w.state === 'verified' || w.state === 'completed' ? 'done' : null),
};

/** The work-order table's columns, dates in the property's own zone. */
export const WORK_ORDER_TABLE_COLUMNS: TableColumn<WorkOrderSummary>[] = WORK_ORDER_COLUMNS.map((id) => ({
  id,
  label: COLUMN_LABELS[id],
  text: TEXT[id],
  sortKey: (WORK_ORDER_SORTS as readonly string[]).includes(id) ? id : undefined,
  tone: TONES[id],
}));
