import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  ApplianceChange,
  ApplianceInputFields,
  ApplianceQueryInput,
  ApplianceView,
  Page,
  PairSensorFields,
  SensorCredentials,
} from '../../../shared/api/inventory';
import { toParams } from './http-params';

/** `/api/inventory/appliances`: appliances with their place and sensor; pairing a sensor. */
@Injectable({ providedIn: 'root' })
export class ApplianceInventoryApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/inventory/appliances';

  list(query: ApplianceQueryInput): Observable<Page<ApplianceView>> {
    return this.http.get<Page<ApplianceView>>(this.base, { params: toParams(query) });
  }

  create(input: ApplianceInputFields): Observable<ApplianceView> {
    return this.http.post<ApplianceView>(this.base, input);
  }

  change(applianceId: string, change: ApplianceChange): Observable<ApplianceView> {
    return this.http.patch<ApplianceView>(`${this.base}/${applianceId}`, change);
  }

  archive(applianceId: string): Observable<ApplianceView> {
    return this.http.post<ApplianceView>(`${this.base}/${applianceId}/archive`, {});
  }

  restore(applianceId: string): Observable<ApplianceView> {
    return this.http.post<ApplianceView>(`${this.base}/${applianceId}/restore`, {});
  }

  pairSensor(applianceId: string, request: PairSensorFields): Observable<SensorCredentials> {
    return this.http.post<SensorCredentials>(`${this.base}/${applianceId}/sensor`, request);
  }
}
