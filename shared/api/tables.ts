/**
 * What the manager's three tables (incidents, service requests, work orders) share with
 * the server: sort direction, the common filters, the columns each table and its CSV
 * export know, and the export's row cap. Shared by client and server.
 */
import { z } from 'zod';

export const SORT_DIRECTIONS = ['asc', 'desc'] as const;
export type SortDirection = (typeof SORT_DIRECTIONS)[number];

/** A free-text search: trimmed, at most 100 characters, empty means none. */
export const SearchText = z
  .string()
  .trim()
  .max(100)
  .optional()
  .transform((text) => (text ? text : undefined));

const IsoInstant = z.iso.datetime({ offset: true });

/** The opened-date range shared by the three lists: from inclusive, to exclusive. */
export const OpenedRange = {
  openedFrom: IsoInstant.optional(),
  openedTo: IsoInstant.optional(),
};

/** An export holds at most this many rows: past that the filters must narrow it (a spreadsheet stays workable). */
export const EXPORT_MAX_ROWS = 10_000;

/** Where a row is: names for the table, the property's time zone for its dates. */
export interface PlaceLabels {
  propertyName: string;
  timeZone: string;
  unitLabel: string | null;
  /** Style and model of the appliance, e.g. "top-freezer RT18". */
  applianceLabel: string | null;
}

export const INCIDENT_COLUMNS = ['openedAt', 'property', 'unit', 'appliance', 'kind', 'severity', 'topCause', 'minutesAbove4c', 'status', 'closedAt'] as const;
export type IncidentColumn = (typeof INCIDENT_COLUMNS)[number];

export const REQUEST_COLUMNS = ['openedAt', 'title', 'property', 'unit', 'appliance', 'source', 'priority', 'status', 'progress', 'contractor', 'closedAt'] as const;
export type RequestColumn = (typeof REQUEST_COLUMNS)[number];

export const WORK_ORDER_COLUMNS = ['dueAt', 'title', 'property', 'unit', 'contractor', 'priority', 'state', 'overdue', 'dispatchedAt', 'scheduledStartAt'] as const;
export type WorkOrderColumn = (typeof WORK_ORDER_COLUMNS)[number];

/** Column headings, in the table and in the CSV's header row. */
export const COLUMN_LABELS: Readonly<Record<IncidentColumn | RequestColumn | WorkOrderColumn, string>> = {
  openedAt: 'Opened',
  closedAt: 'Closed',
  property: 'Property',
  unit: 'Unit',
  appliance: 'Appliance',
  kind: 'Kind',
  severity: 'Severity',
  topCause: 'Probable cause',
  minutesAbove4c: 'Minutes above 4 °C (40 °F)',
  status: 'Status',
  title: 'Title',
  source: 'Opened by',
  priority: 'Priority',
  progress: 'Progress',
  contractor: 'Contractor',
  dueAt: 'Due',
  state: 'State',
  overdue: 'Overdue',
  dispatchedAt: 'Dispatched',
  scheduledStartAt: 'Visit',
};

/** `columns=a,b,c` of an export: known ids in the order given, all of the table's when left out. */
export function ColumnsParam<C extends string>(known: readonly C[]) {
  return z
    .string()
    .optional()
    .transform((text, ctx) => {
      if (!text) return [...known];
      const ids = [...new Set(text.split(',').map((id) => id.trim()).filter(Boolean))];
      const unknown = ids.filter((id) => !(known as readonly string[]).includes(id));
      if (unknown.length || !ids.length) {
        ctx.addIssue({ code: 'custom', message: `unknown columns: ${unknown.join(', ') || '(none given)'}; known: ${known.join(', ')}` });
        return z.NEVER;
      }
      return ids as C[];
    });
}
