import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, map } from 'rxjs';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import type { Page } from '../../../shared/api/users';
import type { ContractorView, Priority, WorkOrderSummary } from '../../../shared/api/work-orders';

/** One service request and what the manager does with it. */
@Injectable({ providedIn: 'root' })
export class RequestApi {
  private readonly http = inject(HttpClient);

  get(requestId: string): Observable<ServiceRequestView> {
    return this.http.get<ServiceRequestView>(`/api/service-requests/${requestId}`);
  }

  /** Every work order of the request, any state, oldest dispatch first. */
  workOrders(requestId: string): Observable<WorkOrderSummary[]> {
    const params = { serviceRequestId: requestId, status: 'all', sort: 'dispatchedAt', dir: 'asc', pageSize: 200 };
    return this.http.get<Page<WorkOrderSummary>>('/api/work-orders', { params }).pipe(map((page) => page.items));
  }

  /** The other open requests of a property: where this one may be merged. */
  openRequestsOf(propertyId: string): Observable<ServiceRequestView[]> {
    const params = { propertyId, status: 'open', pageSize: 200 };
    return this.http.get<Page<ServiceRequestView>>('/api/service-requests', { params }).pipe(map((page) => page.items));
  }

  contractors(): Observable<ContractorView[]> {
    return this.http.get<ContractorView[]>('/api/contractors');
  }

  /** Without a contractor: the one covering the property and appliance style. */
  dispatch(requestId: string, contractorId?: string): Observable<ServiceRequestView> {
    return this.http.post<ServiceRequestView>(`/api/service-requests/${requestId}/dispatch`, contractorId ? { contractorId } : {});
  }

  cancel(requestId: string, reason: string): Observable<ServiceRequestView> {
    return this.http.post<ServiceRequestView>(`/api/service-requests/${requestId}/cancel`, { reason });
  }

  merge(requestId: string, intoRequestId: string): Observable<ServiceRequestView> {
    return this.http.post<ServiceRequestView>(`/api/service-requests/${requestId}/merge`, { intoRequestId });
  }

  reprioritise(requestId: string, priority: Priority): Observable<ServiceRequestView> {
    return this.http.patch<ServiceRequestView>(`/api/service-requests/${requestId}`, { priority });
  }
}
