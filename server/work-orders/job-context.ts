/**
 * Everything the e-mails and pages say about a job or a request, loaded in one query
 * each: place, appliance, the incident's diagnosis and the tenant's access notes.
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { AccessWindow, Priority, WorkOrderState } from '../../shared/api/work-orders';
import type { ApplianceStyle, CauseCode } from '../../shared/domain';
import type { ProbableCause } from '../detection/types';

type Db = DataSource | EntityManager;

export interface RequestContext {
  requestId: string;
  organizationId: string;
  level: 'appliance' | 'property';
  source: 'monitor' | 'tenant' | 'manager';
  priority: Priority;
  title: string;
  status: string;
  propertyId: string;
  propertyName: string;
  address: string;
  timeZone: string;
  unitId: string | null;
  unitLabel: string | null;
  applianceId: string | null;
  style: ApplianceStyle | null;
  model: string;
  serial: string;
  incidentId: string | null;
  topCause: CauseCode | null;
  probableCauses: ProbableCause[];
  minutesAbove4c: number;
  applianceCount: number;
  symptoms: string[];
  accessWindows: AccessWindow[];
  petPresent: boolean;
}

export interface JobContext extends RequestContext {
  workOrderId: string;
  state: WorkOrderState;
  workPriority: Priority;
  dueAt: Date;
  scheduledStartAt: Date | null;
  scheduledEndAt: Date | null;
  contractorId: string;
  contractorName: string;
  contractorEmail: string;
}

const REQUEST_SELECT = `
  r.id AS request_id, r.organization_id, r.level, r.source, r.priority, r.title, r.status, r.property_id, p.name AS property_name,
  concat_ws(', ', p.address_line1, p.address_line2, p.city, nullif(p.region, '')) AS address, p.time_zone,
  r.unit_id, u.label AS unit_label, r.appliance_id, a.style, coalesce(a.model, '') AS model, coalesce(a.serial, '') AS serial,
  r.incident_id, i.top_cause, coalesce(i.probable_causes, '[]'::jsonb) AS probable_causes, coalesce(i.minutes_above_4c, 0) AS minutes_above_4c,
  coalesce(cardinality(i.appliance_ids), 0) AS appliance_count, r.symptoms,
  coalesce((SELECT jsonb_agg(w) FROM tenant_report t, jsonb_array_elements(t.access_windows) w WHERE t.service_request_id = r.id), '[]'::jsonb) AS access_windows,
  coalesce((SELECT bool_or(t.pet_present) FROM tenant_report t WHERE t.service_request_id = r.id), false) AS pet_present`;

const REQUEST_JOINS = `
  FROM service_request r JOIN property p ON p.id = r.property_id
  LEFT JOIN unit u ON u.id = r.unit_id LEFT JOIN appliance a ON a.id = r.appliance_id LEFT JOIN incident i ON i.id = r.incident_id`;

function requestContextOf(row: Record<string, unknown>): RequestContext {
  return {
    requestId: row.request_id as string,
    organizationId: row.organization_id as string,
    level: row.level as RequestContext['level'],
    source: row.source as RequestContext['source'],
    priority: row.priority as Priority,
    title: row.title as string,
    status: row.status as string,
    propertyId: row.property_id as string,
    propertyName: row.property_name as string,
    address: row.address as string,
    timeZone: row.time_zone as string,
    unitId: (row.unit_id as string | null) ?? null,
    unitLabel: (row.unit_label as string | null) ?? null,
    applianceId: (row.appliance_id as string | null) ?? null,
    style: (row.style as ApplianceStyle | null) ?? null,
    model: row.model as string,
    serial: row.serial as string,
    incidentId: (row.incident_id as string | null) ?? null,
    topCause: (row.top_cause as CauseCode | null) ?? null,
    probableCauses: row.probable_causes as ProbableCause[],
    minutesAbove4c: Number(row.minutes_above_4c),
    applianceCount: Number(row.appliance_count),
    symptoms: row.symptoms as string[],
    accessWindows: row.access_windows as AccessWindow[],
    petPresent: row.pet_present as boolean,
  };
}

export async function loadRequestContext(db: Db, requestId: string): Promise<RequestContext | null> {
  const [row] = await db.query(`SELECT ${REQUEST_SELECT} ${REQUEST_JOINS} WHERE r.id = $1`, [requestId]);
  return row ? requestContextOf(row) : null;
}

export async function loadJobContext(db: Db, workOrderId: string): Promise<JobContext | null> {
  const [row] = await db.query(
    `SELECT ${REQUEST_SELECT}, wo.id AS work_order_id, wo.state, wo.priority AS work_priority, wo.due_at, wo.scheduled_start_at, wo.scheduled_end_at,
            c.id AS contractor_id, c.name AS contractor_name, c.email AS contractor_email
       ${REQUEST_JOINS} JOIN work_order wo ON wo.service_request_id = r.id JOIN contractor c ON c.id = wo.contractor_id
      WHERE wo.id = $1`,
    [workOrderId],
  );
  if (!row) return null;
  return {
    ...requestContextOf(row),
    workOrderId: row.work_order_id,
    state: row.state,
    workPriority: row.work_priority,
    dueAt: row.due_at,
    scheduledStartAt: row.scheduled_start_at,
    scheduledEndAt: row.scheduled_end_at,
    contractorId: row.contractor_id,
    contractorName: row.contractor_name,
    contractorEmail: row.contractor_email,
  };
}

const STYLE_WORDS: Record<ApplianceStyle, string> = {
  'top-freezer': 'top-freezer refrigerator',
  'bottom-freezer': 'bottom-freezer refrigerator',
  'side-by-side': 'side-by-side refrigerator',
  'fresh-food-only': 'refrigerator',
  'upright-freezer': 'upright freezer',
  'chest-freezer': 'chest freezer',
};

export function applianceWords(style: ApplianceStyle | null): string {
  return style ? STYLE_WORDS[style] : 'appliance';
}

/** A time in the property's own zone, e.g. "Mar 2, 2026, 9:00 AM CST". */
export function localTime(at: Date | string, timeZone: string): string {
  // dateStyle cannot be combined with timeZoneName, so the fields are spelled out.
  const format = { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit', timeZone, timeZoneName: 'short' } as const;
  return new Intl.DateTimeFormat('en-US', format).format(new Date(at));
}
