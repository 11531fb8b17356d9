import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ApplianceDetail } from '../../../shared/api/appliances';
import type { ApplianceHistory } from '../../../shared/api/telemetry';

export interface HistoryRange {
  fromMs: number;
  toMs: number;
}

/** `GET /api/appliances/:id` and its readings, `GET /api/appliances/:id/history`. */
@Injectable({ providedIn: 'root' })
export class ApplianceApi {
  private readonly http = inject(HttpClient);

  detail(id: string): Observable<ApplianceDetail> {
    return this.http.get<ApplianceDetail>(`/api/appliances/${encodeURIComponent(id)}`);
  }

  /** The server picks raw readings, 5-minute or hourly rollups so that about `maxPoints` come back per probe. */
  history(id: string, range: HistoryRange, maxPoints: number): Observable<ApplianceHistory> {
    const params = new HttpParams()
      .set('from', new Date(range.fromMs).toISOString())
      .set('to', new Date(range.toMs).toISOString())
      .set('maxPoints', String(Math.round(maxPoints)));
    return this.http.get<ApplianceHistory>(`/api/appliances/${encodeURIComponent(id)}/history`, { params });
  }
}
