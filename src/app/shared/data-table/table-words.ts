/** Words the manager's tables and the request page show for codes. */
import type { RequestProgress, RequestSource, RequestStatus } from '../../../../shared/api/service-requests';
import type { Priority, WorkOrderState } from '../../../../shared/api/work-orders';
import { CAUSE_CODES, FINDING_KINDS, SEVERITIES, type CauseCode } from '../../../../shared/domain';
import { CAUSES } from '../../../../shared/causes';
import { KIND_LABELS, SEVERITY_LABELS } from '../../fleet/appliance-words';
import type { FilterOption } from './table-types';

export const WORK_ORDER_STATE_LABELS: Readonly<Record<WorkOrderState, string>> = {
  dispatched: 'dispatched',
  accepted: 'accepted',
  scheduled: 'scheduled',
  'on-site': 'technician on site',
  completed: 'completed',
  verified: 'verified',
  declined: 'declined',
  reopened: 'reopened',
  cancelled: 'cancelled',
};

export const PRIORITY_LABELS: Readonly<Record<Priority, string>> = { urgent: 'urgent', routine: 'routine' };

export const REQUEST_STATUS_LABELS: Readonly<Record<RequestStatus, string>> = { open: 'open', closed: 'closed', cancelled: 'cancelled', merged: 'merged' };

export const REQUEST_SOURCE_LABELS: Readonly<Record<RequestSource, string>> = { monitor: 'monitor finding', tenant: 'tenant report', manager: 'manager' };

export const PROGRESS_LABELS: Readonly<Record<RequestProgress, string>> = Object.fromEntries(
  (['received', 'dispatched', 'accepted', 'scheduled', 'technician on site', 'completed', 'verified', 'closed', 'cancelled'] as const).map((p) => [p, p]),
) as Record<RequestProgress, string>;

export function causeTitle(code: CauseCode | null): string {
  return code ? CAUSES[code].title : '—';
}

/** A select's choices: "any" first, then each code with its words. */
export function choices<K extends string>(anyLabel: string, labels: Readonly<Record<K, string>>, codes: readonly K[] = Object.keys(labels) as K[]): FilterOption[] {
  return [{ value: '', label: anyLabel }, ...codes.map((code) => ({ value: code, label: capitalise(labels[code]) }))];
}

export const SEVERITY_CHOICES = choices('Any severity', SEVERITY_LABELS, [...SEVERITIES].reverse());
export const KIND_CHOICES = choices('Any kind', KIND_LABELS, FINDING_KINDS);
export const CAUSE_CHOICES = choices('Any cause', Object.fromEntries(CAUSE_CODES.map((code) => [code, CAUSES[code].title])) as Record<CauseCode, string>, CAUSE_CODES);
export const PRIORITY_CHOICES = choices('Any priority', PRIORITY_LABELS);

function capitalise(text: string): string {
  return text ? text[0].toUpperCase() + text.slice(1) : text;
}

/** The tone of a severity or priority badge. */
export function severityTone(severity: string): string | null {
  return severity === 'info' ? null : severity;
}
