import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, SensorChange, SensorCredentials, SensorQueryInput, SensorView } from '../../../shared/api/inventory';
import type { SensorRejectsView } from '../../../shared/api/telemetry';
import { toParams } from './http-params';

/** `/api/inventory/sensors`: the organization's sensors; `/api/sensors/:id/rejects`: what the broker and ingest refused of one. */
@Injectable({ providedIn: 'root' })
export class SensorApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/inventory/sensors';

  list(query: SensorQueryInput): Observable<Page<SensorView>> {
    return this.http.get<Page<SensorView>>(this.base, { params: toParams(query) });
  }

  get(sensorId: string): Observable<SensorView> {
    return this.http.get<SensorView>(`${this.base}/${sensorId}`);
  }

  rejects(sensorId: string): Observable<SensorRejectsView> {
    return this.http.get<SensorRejectsView>(`/api/sensors/${sensorId}/rejects`);
  }

  change(sensorId: string, change: SensorChange): Observable<SensorView> {
    return this.http.patch<SensorView>(`${this.base}/${sensorId}`, change);
  }

  newSecret(sensorId: string): Observable<SensorCredentials> {
    return this.http.post<SensorCredentials>(`${this.base}/${sensorId}/secret`, {});
  }

  archive(sensorId: string): Observable<SensorView> {
    return this.http.post<SensorView>(`${this.base}/${sensorId}/archive`, {});
  }

  restore(sensorId: string): Observable<SensorView> {
    return this.http.post<SensorView>(`${this.base}/${sensorId}/restore`, {});
  }
}
