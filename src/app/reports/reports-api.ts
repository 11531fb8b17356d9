import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ReportTable } from '../../../shared/api/reports-constants';
import type { ReportView } from '../../../shared/api/reports';

/** What the manager chose; null leaves the choice to the server (the last twelve months, every property). */
export interface ReportFilters {
  from: string | null;
  to: string | null;
  propertyId: string | null;
}

export const NO_FILTERS: ReportFilters = { from: null, to: null, propertyId: null };

export function reportParams(filters: ReportFilters): HttpParams {
  let params = new HttpParams();
  if (filters.from) params = params.set('from', filters.from);
  if (filters.to) params = params.set('to', filters.to);
  if (filters.propertyId) params = params.set('propertyId', filters.propertyId);
  return params;
}

/** `GET /api/reports` and the address of each table's CSV download. */
@Injectable({ providedIn: 'root' })
export class ReportsApi {
  private readonly http = inject(HttpClient);

  report(filters: ReportFilters): Observable<ReportView> {
    return this.http.get<ReportView>('/api/reports', { params: reportParams(filters) });
  }

  /** A plain link: the browser downloads it with the session cookie, and the server logs the export. */
  csvUrl(table: ReportTable, filters: ReportFilters): string {
    const query = reportParams(filters).toString();
    return `/api/reports/${table}.csv${query ? `?${query}` : ''}`;
  }
}
