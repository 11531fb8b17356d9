import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { TenantHomeView, TenantReportInput, TenantReportResult } from '../../../shared/api/tenant';

/** `/api/tenant`: the tenant's own unit and the problem report. */
@Injectable({ providedIn: 'root' })
export class TenantHomeApi {
  private readonly http = inject(HttpClient);

  home(): Observable<TenantHomeView> {
    return this.http.get<TenantHomeView>('/api/tenant/home');
  }

  /** multipart/form-data: the report as JSON in `report`, each photo in `photos` (the server's contract). */
  report(report: TenantReportInput, photos: readonly File[]): Observable<TenantReportResult> {
    const form = new FormData();
    form.append('report', JSON.stringify(report));
    for (const photo of photos) form.append('photos', photo, photo.name);
    return this.http.post<TenantReportResult>('/api/tenant/reports', form);
  }
}
