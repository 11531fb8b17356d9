/**
 * The date range of a report: whole calendar days in the manager's time zone. Without
 * dates it covers the last twelve calendar months, this one included, up to today.
 */
import { DEFAULT_REPORT_MONTHS, MAX_REPORT_MONTHS } from '../../shared/api/reports-constants';
import type { ReportQuery, ReportRange } from '../../shared/api/reports';
import { badRequest } from '../errors';

/** Today's calendar date (YYYY-MM-DD) in an IANA zone. */
export function localDate(atMs: number, timeZone: string): string {
  // en-CA formats dates as YYYY-MM-DD.
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(atMs);
}

/** The first day of the month `monthsBack` months before the month of `date`. */
export function monthStartBefore(date: string, monthsBack: number): string {
  const [year, month] = date.split('-').map(Number);
  const index = year * 12 + (month - 1) - monthsBack;
  return `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}-01`;
}

function monthsSpanned(from: string, to: string): number {
  const [fromYear, fromMonth] = from.split('-').map(Number);
  const [toYear, toMonth] = to.split('-').map(Number);
  return (toYear - fromYear) * 12 + (toMonth - fromMonth) + 1;
}

function knownZone(timeZone: string | null): string {
  if (!timeZone) return 'UTC';
  try {
    new Intl.DateTimeFormat('en', { timeZone });
    return timeZone;
  } catch {
    return 'UTC';
  }
}

export function resolveRange(query: ReportQuery, timeZone: string | null, nowMs: number): ReportRange {
  const zone = knownZone(timeZone);
  const to = query.to ?? localDate(nowMs, zone);
  const from = query.from ?? monthStartBefore(to, DEFAULT_REPORT_MONTHS - 1);
  if (from > to) throw badRequest('the range ends before it starts');
  if (monthsSpanned(from, to) > MAX_REPORT_MONTHS) throw badRequest(`a report covers at most ${MAX_REPORT_MONTHS} months`);
  return { from, to, timeZone: zone, propertyId: query.propertyId ?? null };
}
