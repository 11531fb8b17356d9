/**
 * The work order's life: dispatched → accepted → scheduled → on-site → completed →
 * verified, with declined, reopened (failed verification) and cancelled. A transition
 * not listed here is refused with 409.
 */
import type { WorkOrderState } from '../../shared/api/work-orders';
import { conflict } from '../errors';

const TRANSITIONS: Record<WorkOrderState, readonly WorkOrderState[]> = {
  dispatched: ['accepted', 'declined', 'cancelled'],
  accepted: ['scheduled', 'on-site', 'cancelled'],
  scheduled: ['scheduled', 'on-site', 'cancelled'],
  'on-site': ['completed', 'cancelled'],
  completed: ['verified', 'reopened'],
  reopened: ['scheduled', 'on-site', 'cancelled'],
  verified: [],
  declined: [],
  cancelled: [],
};

export function canMove(from: WorkOrderState, to: WorkOrderState): boolean {
  return TRANSITIONS[from].includes(to);
}

export function assertMove(from: WorkOrderState, to: WorkOrderState): void {
  if (!canMove(from, to)) throw conflict(`a work order that is ${from} cannot become ${to}`);
}

/** Where parts, labour, photos and notes may still be recorded. */
export function isWorkable(state: WorkOrderState): boolean {
  return state === 'accepted' || state === 'scheduled' || state === 'on-site' || state === 'reopened' || state === 'completed';
}
