/** The report's range and property kept in the query string, so a reload or a shared link shows the same report. */
import type { ParamMap, Params } from '@angular/router';
import type { ReportFilters } from './reports-api';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A real calendar date as YYYY-MM-DD (2026-02-30 is not one). */
export function isIsoDate(value: string | null | undefined): value is string {
  if (!value || !/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const date = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === value;
}

/** A hand-edited link with a bad date or a backwards range falls back to the default range. */
export function filtersFromParams(params: ParamMap): ReportFilters {
  const from = params.get('from');
  const to = params.get('to');
  const propertyId = params.get('property');
  const datesOk = isIsoDate(from) && isIsoDate(to) && from <= to;
  return { from: datesOk ? from : null, to: datesOk ? to : null, propertyId: propertyId && UUID.test(propertyId) ? propertyId : null };
}

export function paramsFromFilters(filters: ReportFilters): Params {
  return { from: filters.from, to: filters.to, property: filters.propertyId };
}

/** A local calendar date (what the datepicker gives) as YYYY-MM-DD. */
export function isoDateOf(date: Date): string {
  return `${date.getFullYear()}-${String(date.getMonth() + 1).padStart(2, '0')}-${String(date.getDate()).padStart(2, '0')}`;
}

/** YYYY-MM-DD as a local Date at midnight, for the datepicker. */
export function dateOfIso(value: string): Date {
  const [year, month, day] = value.split('-').map(Number);
  return new Date(year, month - 1, day);
}
