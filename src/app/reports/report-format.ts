/** Words and numbers of the reports page. */
import type { ReportCause } from '../../../shared/api/reports';
import { CAUSE_FALLBACK } from '../fleet/appliance-words';

/** Minutes as the largest two units: "45 min", "3 h 10 min", "2 d 4 h". */
export function formatDuration(minutes: number | null): string {
  if (minutes === null) return '—';
  const whole = Math.round(minutes);
  if (whole < 60) return `${whole} min`;
  const hours = Math.floor(whole / 60);
  if (hours < 24) return whole % 60 ? `${hours} h ${whole % 60} min` : `${hours} h`;
  const days = Math.floor(hours / 24);
  return hours % 24 ? `${days} d ${hours % 24} h` : `${days} d`;
}

/** A share 0…1 as a whole percent, or a dash when nothing was judged. */
export function formatRate(rate: number | null): string {
  return rate === null ? '—' : `${Math.round(rate * 100)} %`;
}

export function causeLabel(cause: ReportCause): string {
  if (cause === 'other') return 'other (found on site)';
  if (cause === 'unknown') return 'not known yet';
  return CAUSE_FALLBACK[cause] ?? cause;
}

/** "2026-01" as "Jan 2026". */
export function monthLabel(month: string): string {
  const [year, monthNumber] = month.split('-').map(Number);
  return new Date(Date.UTC(year, monthNumber - 1, 1)).toLocaleDateString('en-US', { month: 'short', year: 'numeric', timeZone: 'UTC' });
}
