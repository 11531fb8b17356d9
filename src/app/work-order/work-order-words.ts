/** The words the job list and the work-order page use for states, priorities, kinds and logged events. */
import type { AttachmentKind, CauseFound, CostStatus, Priority, WorkOrderEventView, WorkOrderState } from '../../../shared/api/work-orders';
import { CAUSES } from '../../../shared/causes';
import { CAUSE_CODES } from '../../../shared/domain';
import { formatZoned } from '../fleet/zoned-date';

export const STATE_LABELS: Readonly<Record<WorkOrderState, string>> = {
  dispatched: 'New — waiting for you to accept',
  accepted: 'Accepted',
  scheduled: 'Visit scheduled',
  'on-site': 'On site',
  completed: 'Completed — checking recovery',
  verified: 'Verified repaired',
  declined: 'Declined',
  reopened: 'Reopened — not recovered',
  cancelled: 'Cancelled',
};

/** Short state words for chips. */
export const STATE_SHORT: Readonly<Record<WorkOrderState, string>> = {
  dispatched: 'new',
  accepted: 'accepted',
  scheduled: 'scheduled',
  'on-site': 'on site',
  completed: 'completed',
  verified: 'verified',
  declined: 'declined',
  reopened: 'reopened',
  cancelled: 'cancelled',
};

export const PRIORITY_LABELS: Readonly<Record<Priority, string>> = { urgent: 'Urgent', routine: 'Routine' };

export const COST_STATUS_LABELS: Readonly<Record<CostStatus, string>> = {
  none: 'No cost to decide yet',
  pending: 'Waiting for the manager',
  approved: 'Approved',
  disputed: 'Disputed',
};

export const ATTACHMENT_KIND_LABELS: Readonly<Record<AttachmentKind, string>> = {
  before: 'Before the repair',
  after: 'After the repair',
  'data-plate': 'Data plate',
  invoice: 'Invoice',
  photo: 'Other photo',
};

/** The kinds a technician picks from, in the order of a visit. */
export const UPLOAD_KINDS: readonly AttachmentKind[] = ['before', 'after', 'data-plate', 'invoice', 'photo'];

/** The cause codes a technician can report, with "other" last. */
export const CAUSE_FOUND_OPTIONS: readonly { value: CauseFound; label: string }[] = [
  ...CAUSE_CODES.map((code) => ({ value: code as CauseFound, label: CAUSES[code].title })),
  { value: 'other', label: 'Something else (say what)' },
];

export function causeFoundLabel(cause: CauseFound | null): string {
  if (!cause) return '—';
  return cause === 'other' ? 'Something else' : CAUSES[cause].title;
}

const EVENT_WORDS: Readonly<Record<string, string>> = {
  dispatched: 'Dispatched',
  accepted: 'Accepted',
  declined: 'Declined',
  scheduled: 'Visit scheduled',
  'on-site': 'Arrived on site',
  completed: 'Completed',
  verified: 'Verified',
  reopened: 'Reopened',
  cancelled: 'Cancelled',
  escalated: 'Escalated to the backup',
  overdue: 'Overdue',
  'notes-updated': 'Notes updated',
  'part-recorded': 'Part recorded',
  'labour-recorded': 'Labour recorded',
  'attachment-added': 'File added',
  'cost-approved': 'Cost approved',
  'cost-disputed': 'Cost disputed',
};

/** "Part recorded", or the state it moved to, or the raw type as a last resort. */
export function eventLabel(event: WorkOrderEventView): string {
  return EVENT_WORDS[event.type] ?? (event.toState ? (EVENT_WORDS[event.toState] ?? STATE_LABELS[event.toState]) : event.type.replace(/-/g, ' '));
}

/** The detail worth reading in the log: a reason, a note, a part, a visit window. */
export function eventDetail(event: WorkOrderEventView, timeZone: string | null): string {
  const detail = event.detail ?? {};
  const text = (key: string) => (typeof detail[key] === 'string' && detail[key] ? (detail[key] as string) : null);
  if (text('reason')) return `Reason: ${text('reason')}`;
  if (text('startAt') && text('endAt')) return `${formatZoned(text('startAt'), timeZone, 'short')} – ${formatZoned(text('endAt'), timeZone, 'time')}`;
  if (typeof detail['name'] === 'string') return `${detail['quantity'] ?? 1} × ${detail['name']}`;
  if (typeof detail['minutes'] === 'number') return `${detail['minutes']} min`;
  if (typeof detail['causeFound'] === 'string') return `Cause found: ${causeFoundLabel(detail['causeFound'] as CauseFound)}`;
  if (text('note')) return `Note: ${text('note')}`;
  if (typeof detail['kind'] === 'string') return ATTACHMENT_KIND_LABELS[detail['kind'] as AttachmentKind] ?? '';
  return '';
}

/** "Tue, Dec 3, 4:00 PM – 8:00 PM" in the property's zone. */
export function windowWords(window: { from: string; to: string }, timeZone: string | null): string {
  return `${formatZoned(window.from, timeZone, 'short')} – ${formatZoned(window.to, timeZone, 'time')}`;
}

/**
 * States in which parts, labour, photos and notes may still be recorded: mirrors the
 * server's rule (server/work-orders/states.ts), which remains the judge.
 */
export const RECORDABLE_STATES: readonly WorkOrderState[] = ['accepted', 'scheduled', 'on-site', 'reopened', 'completed'];
