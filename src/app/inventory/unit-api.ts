import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, UnitChange, UnitInput, UnitQueryInput, UnitView } from '../../../shared/api/inventory';
import { toParams } from './http-params';

/** Units of a property (`/api/inventory/properties/:id/units`) and one unit (`/api/inventory/units/:id`). */
@Injectable({ providedIn: 'root' })
export class UnitApi {
  private readonly http = inject(HttpClient);

  list(propertyId: string, query: UnitQueryInput): Observable<Page<UnitView>> {
    return this.http.get<Page<UnitView>>(`/api/inventory/properties/${propertyId}/units`, { params: toParams(query) });
  }

  create(propertyId: string, input: UnitInput): Observable<UnitView> {
    return this.http.post<UnitView>(`/api/inventory/properties/${propertyId}/units`, input);
  }

  change(unitId: string, change: UnitChange): Observable<UnitView> {
    return this.http.patch<UnitView>(`/api/inventory/units/${unitId}`, change);
  }

  archive(unitId: string): Observable<UnitView> {
    return this.http.post<UnitView>(`/api/inventory/units/${unitId}/archive`, {});
  }

  restore(unitId: string): Observable<UnitView> {
    return this.http.post<UnitView>(`/api/inventory/units/${unitId}/restore`, {});
  }
}
