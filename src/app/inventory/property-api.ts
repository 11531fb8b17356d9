import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, PropertyChange, PropertyInputFields, PropertyQueryInput, PropertyView } from '../../../shared/api/inventory';
import { toParams } from './http-params';

/** `/api/inventory/properties`: the organization's buildings. */
@Injectable({ providedIn: 'root' })
export class PropertyApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/inventory/properties';

  list(query: PropertyQueryInput): Observable<Page<PropertyView>> {
    return this.http.get<Page<PropertyView>>(this.base, { params: toParams(query) });
  }

  get(propertyId: string): Observable<PropertyView> {
    return this.http.get<PropertyView>(`${this.base}/${propertyId}`);
  }

  create(input: PropertyInputFields): Observable<PropertyView> {
    return this.http.post<PropertyView>(this.base, input);
  }

  change(propertyId: string, change: PropertyChange): Observable<PropertyView> {
    return this.http.patch<PropertyView>(`${this.base}/${propertyId}`, change);
  }

  archive(propertyId: string): Observable<PropertyView> {
    return this.http.post<PropertyView>(`${this.base}/${propertyId}/archive`, {});
  }

  restore(propertyId: string): Observable<PropertyView> {
    return this.http.post<PropertyView>(`${this.base}/${propertyId}/restore`, {});
  }
}
