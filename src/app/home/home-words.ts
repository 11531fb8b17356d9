/** Words of the tenant's page: which probes a style has, durations, "last heard from", progress steps. */
import type { RequestProgress, ServiceRequestView } from '../../../shared/api/service-requests';
import type { ApplianceStyle } from '../../../shared/domain';

const FREEZER_ONLY: readonly ApplianceStyle[] = ['upright-freezer', 'chest-freezer'];

export function hasFreshFood(style: ApplianceStyle): boolean {
  return !FREEZER_ONLY.includes(style);
}

export function hasFreezer(style: ApplianceStyle): boolean {
  return style !== 'fresh-food-only';
}

const plural = (count: number, word: string) => `${count} ${word}${count === 1 ? '' : 's'}`;

/** "45 minutes", "2 hours 5 minutes", "3 days 4 hours". */
export function durationWords(minutes: number): string {
  const whole = Math.max(0, Math.round(minutes));
  if (whole < 60) return plural(whole, 'minute');
  const hours = Math.floor(whole / 60);
  if (hours < 48) return whole % 60 ? `${plural(hours, 'hour')} ${plural(whole % 60, 'minute')}` : plural(hours, 'hour');
  const days = Math.floor(hours / 24);
  return hours % 24 ? `${plural(days, 'day')} ${plural(hours % 24, 'hour')}` : plural(days, 'day');
}

/** "just now", "12 minutes ago", "3 hours ago", "2 days ago". */
export function agoWords(atIso: string, nowMs: number): string {
  const minutes = Math.floor((nowMs - Date.parse(atIso)) / 60_000);
  if (minutes < 1) return 'just now';
  if (minutes < 60) return `${plural(minutes, 'minute')} ago`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${plural(hours, 'hour')} ago`;
  return `${plural(Math.floor(hours / 24), 'day')} ago`;
}

/** The four steps a tenant sees; the server's finer progress words fold into them. */
export const PROGRESS_STEPS = ['Received', 'Dispatched', 'Scheduled', 'Completed'] as const;

const STEP_OF: Record<RequestProgress, number> = {
  received: 0,
  dispatched: 1,
  accepted: 1,
  scheduled: 2,
  'technician on site': 2,
  completed: 3,
  verified: 3,
  closed: 3,
  cancelled: -1,
};

/** The step the request stands at (0-based), or -1 for a cancelled request. */
export function progressStep(progress: RequestProgress): number {
  return STEP_OF[progress];
}

type Formatter = (iso: string | null) => string;

/** One sentence per step, saying what happened or what comes next. */
export function stepDetails(request: ServiceRequestView, when: Formatter): string[] {
  const order = request.workOrder;
  const received = request.source === 'monitor' ? `The monitor noticed the trouble on ${when(request.openedAt)}.` : `Your report arrived on ${when(request.openedAt)}.`;
  const dispatched = order
    ? `${order.contractorName} has the job${request.progress === 'accepted' || STEP_OF[request.progress] >= 2 ? ' and has accepted it' : ''}.`
    : 'Your property manager is choosing a repair company.';
  const scheduled =
    request.progress === 'technician on site'
      ? 'The technician is at your unit now.'
      : order?.scheduledStartAt
        ? `A technician is coming ${when(order.scheduledStartAt)}${order.scheduledEndAt ? ` – ${when(order.scheduledEndAt)}` : ''}.`
        : 'The repair company will set a visit time with you.';
  const completed =
    request.progress === 'verified' || request.progress === 'closed'
      ? 'The repair is done and the temperatures are back to normal.'
      : request.progress === 'completed'
        ? 'The repair is done. The sensor is checking that it cools back down.'
        : 'The repair is done once the technician has fixed it and it cools again.';
  return [received, dispatched, scheduled, completed];
}
