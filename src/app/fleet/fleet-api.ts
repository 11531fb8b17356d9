import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { FleetFilters, FleetOverview } from '../../../shared/api/fleet';

/** Query parameters of a filter set: lists comma-separated, empty values left out. */
export function fleetParams(filters: FleetFilters): HttpParams {
  let params = new HttpParams();
  if (filters.property?.length) params = params.set('property', filters.property.join(','));
  if (filters.health?.length) params = params.set('health', filters.health.join(','));
  if (filters.style?.length) params = params.set('style', filters.style.join(','));
  if (filters.age) params = params.set('age', filters.age);
  if (filters.q?.trim()) params = params.set('q', filters.q.trim());
  return params;
}

/** `GET /api/fleet`. */
@Injectable({ providedIn: 'root' })
export class FleetApi {
  private readonly http = inject(HttpClient);

  overview(filters: FleetFilters): Observable<FleetOverview> {
    return this.http.get<FleetOverview>('/api/fleet', { params: fleetParams(filters) });
  }
}
