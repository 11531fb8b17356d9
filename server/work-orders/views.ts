/** Service requests and work orders as the API answers them, each built with a few set-based queries. */
import type { DataSource, EntityManager } from 'typeorm';
import { causeInfo, SAFETY_CAUTIONS } from '../../shared/causes';
import type { IncidentView } from '../../shared/api/monitor';
import type { RequestProgress, ServiceRequestView } from '../../shared/api/service-requests';
import {
  OPEN_WORK_ORDER_STATES,
  type AccessWindow,
  type AttachmentView,
  type WorkOrderEventView,
  type WorkOrderState,
  type WorkOrderSummary,
  type WorkOrderView,
} from '../../shared/api/work-orders';
import type { PlaceLabels } from '../../shared/api/tables';
import type { ApplianceStyle, CauseCode } from '../../shared/domain';
import { INCIDENT_COLUMNS, incidentViewOf } from '../monitor/views';

type Db = DataSource | EntityManager;
type Row = Record<string, unknown>;

/** SQL: two symptom arrays joined without repeats, in the order they were first reported. */
export const MERGED_SYMPTOMS = (first: string, second: string) =>
  `ARRAY(SELECT s FROM unnest(${first} || ${second}) WITH ORDINALITY AS t(s, n) GROUP BY s ORDER BY min(n))`;

const iso = (value: unknown) => (value ? (value as Date).toISOString() : null);

const PROGRESS: Record<WorkOrderState, RequestProgress> = {
  dispatched: 'dispatched',
  accepted: 'accepted',
  scheduled: 'scheduled',
  'on-site': 'technician on site',
  completed: 'completed',
  verified: 'verified',
  reopened: 'dispatched',
  declined: 'received',
  cancelled: 'received',
};

function progressOf(status: string, workOrderState: WorkOrderState | null): RequestProgress {
  if (status === 'cancelled' || status === 'merged') return 'cancelled';
  if (status === 'closed') return workOrderState === 'verified' ? 'verified' : 'closed';
  return workOrderState ? PROGRESS[workOrderState] : 'received';
}

async function incidentsById(db: Db, ids: string[]): Promise<Map<string, IncidentView>> {
  if (!ids.length) return new Map();
  const rows: Row[] = await db.query(`SELECT ${INCIDENT_COLUMNS} FROM incident i WHERE i.id = ANY($1::uuid[])`, [ids]);
  return new Map(rows.map((row) => [row.id as string, incidentViewOf(row)]));
}

/** A request with where it is: conditions and sort keys may use aliases r, p (property), u (unit) and a (appliance). */
export const REQUEST_FROM = `service_request r JOIN property p ON p.id = r.property_id LEFT JOIN unit u ON u.id = r.unit_id LEFT JOIN appliance a ON a.id = r.appliance_id`;

/** SQL: "top-freezer RT18" from the appliance's style and model (alias a), null without an appliance. */
export const APPLIANCE_LABEL_SQL = `nullif(concat_ws(' ', a.style, nullif(a.model, '')), '')`;

export function placeOf(row: Row): PlaceLabels {
  return {
    propertyName: row.property_name as string,
    timeZone: row.property_time_zone as string,
    unitLabel: (row.unit_label as string | null) ?? null,
    applianceLabel: (row.appliance_label as string | null) ?? null,
  };
}

/**
 * Requests matching a condition over REQUEST_FROM's aliases (with its parameters), newest
 * first unless told otherwise; each with its active (else latest) job.
 */
export async function requestViews(db: Db, where: string, params: unknown[], page = { limit: 200, offset: 0 }, orderBy = 'r.opened_at DESC, r.id'): Promise<ServiceRequestView[]> {
  const rows: Row[] = await db.query(
    `SELECT r.*, wo.id AS wo_id, wo.state AS wo_state, wo.scheduled_start_at, wo.scheduled_end_at, wo.due_at, c.name AS contractor_name,
            p.name AS property_name, p.time_zone AS property_time_zone, u.label AS unit_label, ${APPLIANCE_LABEL_SQL} AS appliance_label
       FROM ${REQUEST_FROM}
       LEFT JOIN LATERAL (SELECT * FROM work_order w WHERE w.service_request_id = r.id ORDER BY w.state NOT IN ('verified','declined','cancelled') DESC, w.created_at DESC LIMIT 1) wo ON true
       LEFT JOIN contractor c ON c.id = wo.contractor_id
      WHERE ${where} ORDER BY ${orderBy} LIMIT ${page.limit} OFFSET ${page.offset}`,
    params,
  );
  if (!rows.length) return [];
  const incidents = await incidentsById(db, rows.map((row) => row.incident_id as string | null).filter((id): id is string => !!id));
  const reports = await reportsByRequest(db, rows.map((row) => row.id as string));
  return rows.map((row) => ({
    id: row.id as string,
    level: row.level as ServiceRequestView['level'],
    source: row.source as ServiceRequestView['source'],
    status: row.status as ServiceRequestView['status'],
    priority: row.priority as ServiceRequestView['priority'],
    title: row.title as string,
    description: row.description as string,
    symptoms: row.symptoms as string[],
    propertyId: row.property_id as string,
    unitId: (row.unit_id as string | null) ?? null,
    applianceId: (row.appliance_id as string | null) ?? null,
    openedAt: iso(row.opened_at) as string,
    closedAt: iso(row.closed_at),
    closeReason: (row.close_reason as string | null) ?? null,
    mergedIntoId: (row.merged_into_id as string | null) ?? null,
    firstVisitFix: (row.first_visit_fix as boolean | null) ?? null,
    incident: row.incident_id ? (incidents.get(row.incident_id as string) ?? null) : null,
    progress: progressOf(row.status as string, (row.wo_state as WorkOrderState | null) ?? null),
    workOrder: row.wo_id
      ? {
          id: row.wo_id as string,
          state: row.wo_state as WorkOrderState,
          contractorName: row.contractor_name as string,
          scheduledStartAt: iso(row.scheduled_start_at),
          scheduledEndAt: iso(row.scheduled_end_at),
          dueAt: iso(row.due_at) as string,
        }
      : null,
    place: placeOf(row),
    reports: reports.get(row.id as string) ?? [],
  }));
}

async function reportsByRequest(db: Db, requestIds: string[]): Promise<Map<string, ServiceRequestView['reports']>> {
  const rows: Row[] = await db.query(
    `SELECT t.*, coalesce((SELECT array_agg(a.id ORDER BY a.created_at) FROM attachment a WHERE a.tenant_report_id = t.id), '{}') AS photo_ids
       FROM tenant_report t WHERE t.service_request_id = ANY($1::uuid[]) ORDER BY t.created_at`,
    [requestIds],
  );
  const byRequest = new Map<string, ServiceRequestView['reports']>();
  for (const row of rows) {
    const list = byRequest.get(row.service_request_id as string) ?? [];
    list.push({
      id: row.id as string,
      createdAt: iso(row.created_at) as string,
      symptoms: row.symptoms as string[],
      description: row.description as string,
      petPresent: row.pet_present as boolean,
      accessWindows: row.access_windows as { from: string; to: string }[],
      photoIds: row.photo_ids as string[],
    });
    byRequest.set(row.service_request_id as string, list);
  }
  return byRequest;
}

const SUMMARY_SELECT = `
  SELECT wo.*, r.title, r.unit_id, r.appliance_id, r.property_id, r.incident_id, r.symptoms, p.name AS property_name,
         concat_ws(', ', p.address_line1, p.address_line2, p.city, nullif(p.region, '')) AS address, p.time_zone, u.label AS unit_label, c.name AS contractor_name,
         i.top_cause AS suspected_cause,
         coalesce((SELECT jsonb_agg(w ORDER BY t.created_at) FROM tenant_report t, jsonb_array_elements(t.access_windows) w WHERE t.service_request_id = r.id), '[]'::jsonb) AS access_windows,
         coalesce((SELECT bool_or(t.pet_present) FROM tenant_report t WHERE t.service_request_id = r.id), false) AS pet_present
    FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id JOIN property p ON p.id = r.property_id
    LEFT JOIN unit u ON u.id = r.unit_id JOIN contractor c ON c.id = wo.contractor_id LEFT JOIN incident i ON i.id = r.incident_id`;

export function isOverdue(row: { state: WorkOrderState; due_at: Date }, nowMs: number): boolean {
  return OPEN_WORK_ORDER_STATES.includes(row.state) && row.due_at.getTime() < nowMs;
}

function summaryOf(row: Row, nowMs: number): WorkOrderSummary {
  return {
    id: row.id as string,
    serviceRequestId: row.service_request_id as string,
    state: row.state as WorkOrderState,
    priority: row.priority as WorkOrderSummary['priority'],
    title: row.title as string,
    contractor: { id: row.contractor_id as string, name: row.contractor_name as string },
    property: { id: row.property_id as string, name: row.property_name as string, address: row.address as string, timeZone: row.time_zone as string },
    unit: row.unit_id ? { id: row.unit_id as string, label: row.unit_label as string } : null,
    applianceId: (row.appliance_id as string | null) ?? null,
    dispatchedAt: iso(row.dispatched_at) as string,
    dueAt: iso(row.due_at) as string,
    overdue: isOverdue(row as { state: WorkOrderState; due_at: Date }, nowMs),
    scheduledStartAt: iso(row.scheduled_start_at),
    scheduledEndAt: iso(row.scheduled_end_at),
    suspectedCause: (row.suspected_cause as CauseCode | null) ?? null,
    accessWindows: row.access_windows as AccessWindow[],
    petPresent: row.pet_present === true,
  };
}

/** Conditions and sort keys over work-order summaries may use aliases wo, r, p, u and c (contractor). */
export const WORK_ORDER_FROM = `work_order wo JOIN service_request r ON r.id = wo.service_request_id JOIN property p ON p.id = r.property_id
    LEFT JOIN unit u ON u.id = r.unit_id JOIN contractor c ON c.id = wo.contractor_id`;

export async function workOrderSummaries(db: Db, where: string, params: unknown[], nowMs: number, page: { limit: number; offset: number }, orderBy = 'wo.due_at, wo.id'): Promise<WorkOrderSummary[]> {
  const rows: Row[] = await db.query(`${SUMMARY_SELECT} WHERE ${where} ORDER BY ${orderBy} LIMIT ${page.limit} OFFSET ${page.offset}`, params);
  return rows.map((row) => summaryOf(row, nowMs));
}

export async function workOrderView(db: Db, workOrderId: string, nowMs: number): Promise<WorkOrderView | null> {
  const [row]: Row[] = await db.query(`${SUMMARY_SELECT} WHERE wo.id = $1`, [workOrderId]);
  if (!row) return null;
  const [appliance]: Row[] = row.appliance_id ? await db.query(`SELECT id, style, model, serial FROM appliance WHERE id = $1`, [row.appliance_id]) : [];
  const incident = row.incident_id ? ((await incidentsById(db, [row.incident_id as string])).get(row.incident_id as string) ?? null) : null;
  const [visits, parts, labour, attachments, events] = await Promise.all([
    db.query(`SELECT id, arrived_at, left_at, notes FROM work_order_visit WHERE work_order_id = $1 ORDER BY arrived_at`, [workOrderId]) as Promise<Row[]>,
    db.query(`SELECT id, name, quantity, unit_cost_cents, currency FROM work_order_part WHERE work_order_id = $1 ORDER BY created_at`, [workOrderId]) as Promise<Row[]>,
    db.query(`SELECT id, minutes, hourly_rate_cents, currency FROM work_order_labour WHERE work_order_id = $1 ORDER BY created_at`, [workOrderId]) as Promise<Row[]>,
    attachmentsOf(db, workOrderId),
    eventsOf(db, workOrderId),
  ]);
  const currency = row.currency as string;
  const partsCents = parts.reduce((sum, p) => sum + Number(p.quantity) * Number(p.unit_cost_cents), 0);
  // Labour cost rounds to the cent: minutes × rate per hour / 60.
  const labourCents = labour.reduce((sum, l) => sum + Math.round((Number(l.minutes) * Number(l.hourly_rate_cents)) / 60), 0);
  const topCause = incident?.topCause ?? null;
  return {
    ...summaryOf(row, nowMs),
    dispatchMethod: row.dispatch_method as WorkOrderView['dispatchMethod'],
    acceptedAt: iso(row.accepted_at),
    completedAt: iso(row.completed_at),
    verifiedAt: iso(row.verified_at),
    verificationDueAt: iso(row.verification_due_at),
    reopenedCount: Number(row.reopened_count),
    escalatedAt: iso(row.escalated_at),
    causeFound: (row.cause_found as WorkOrderView['causeFound']) ?? null,
    causeNote: (row.cause_note as string | null) ?? null,
    findings: row.findings as string,
    notes: row.notes as string,
    appliance: appliance ? { id: appliance.id as string, style: appliance.style as ApplianceStyle, model: appliance.model as string, serial: appliance.serial as string } : null,
    diagnosis: {
      incident,
      topCause,
      cause: topCause ? causeInfo(topCause) : null,
      severity: incident?.severity ?? null,
      historyFromMs: incident ? Date.parse(incident.startedAt) - 12 * 3_600_000 : null,
      historyToMs: incident ? (incident.closedAt ? Date.parse(incident.closedAt) + 6 * 3_600_000 : nowMs) : null,
    },
    cautions: SAFETY_CAUTIONS,
    symptoms: row.symptoms as string[],
    visits: visits.map((v) => ({ id: v.id as string, arrivedAt: iso(v.arrived_at) as string, leftAt: iso(v.left_at), notes: v.notes as string })),
    parts: parts.map((p) => ({ id: p.id as string, name: p.name as string, quantity: Number(p.quantity), unitCostCents: Number(p.unit_cost_cents), currency: p.currency as string })),
    labour: labour.map((l) => ({ id: l.id as string, minutes: Number(l.minutes), hourlyRateCents: Number(l.hourly_rate_cents), currency: l.currency as string })),
    totals: { parts: { cents: partsCents, currency }, labour: { cents: labourCents, currency }, total: { cents: partsCents + labourCents, currency } },
    costStatus: row.cost_status as WorkOrderView['costStatus'],
    costNote: (row.cost_note as string | null) ?? null,
    attachments,
    events,
  };
}

export function attachmentViewOf(row: Row): AttachmentView {
  return {
    id: row.id as string,
    kind: row.kind as AttachmentView['kind'],
    contentType: row.content_type as string,
    sizeBytes: Number(row.size_bytes),
    displayName: row.display_name as string,
    url: `/api/attachments/${row.id}`,
    thumbnailUrl: row.thumbnail_key ? `/api/attachments/${row.id}/thumbnail` : null,
    createdAt: iso(row.created_at) as string,
  };
}

async function attachmentsOf(db: Db, workOrderId: string): Promise<AttachmentView[]> {
  const rows: Row[] = await db.query(`SELECT * FROM attachment WHERE work_order_id = $1 ORDER BY created_at`, [workOrderId]);
  return rows.map(attachmentViewOf);
}

async function eventsOf(db: Db, workOrderId: string): Promise<WorkOrderEventView[]> {
  const rows: Row[] = await db.query(
    `SELECT e.*, u.display_name FROM work_order_event e LEFT JOIN app_user u ON u.id = e.actor_user_id WHERE e.work_order_id = $1 ORDER BY e.id`,
    [workOrderId],
  );
  return rows.map((e) => ({
    at: iso(e.at) as string,
    actor: e.actor_kind === 'system' ? null : { userId: (e.actor_user_id as string | null) ?? null, displayName: (e.display_name as string | null) ?? 'former user' },
    type: e.type as string,
    fromState: (e.from_state as WorkOrderState | null) ?? null,
    toState: (e.to_state as WorkOrderState | null) ?? null,
    detail: e.detail as Record<string, unknown>,
  }));
}
