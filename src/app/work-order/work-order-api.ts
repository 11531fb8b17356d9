import { HttpClient, HttpEventType, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, filter, map } from 'rxjs';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import type { Page } from '../../../shared/api/users';
import type {
  AttachmentKind,
  AttachmentView,
  CompleteRequest,
  RecordLabourRequest,
  RecordPartRequest,
  ScheduleRequest,
  WorkOrderQuery,
  WorkOrderSummary,
  WorkOrderView,
} from '../../../shared/api/work-orders';
import { toParams } from '../inventory/http-params';

/** What the job page reads of its service request: the words and photos the tenant sent. */
export type RequestReports = Pick<ServiceRequestView, 'id' | 'source' | 'description' | 'reports'>;

/** An upload as it goes: the share sent so far, then the stored attachment. */
export type UploadProgress = { kind: 'progress'; percent: number } | { kind: 'done'; attachment: AttachmentView };

/** `/api/work-orders`: the jobs in reach, one job, and every step and record on it. */
@Injectable({ providedIn: 'root' })
export class WorkOrderApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/work-orders';

  list(query: Partial<Pick<WorkOrderQuery, 'status' | 'page' | 'pageSize'>>): Observable<Page<WorkOrderSummary>> {
    return this.http.get<Page<WorkOrderSummary>>(this.base, { params: toParams(query) });
  }

  get(id: string): Observable<WorkOrderView> {
    return this.http.get<WorkOrderView>(this.url(id));
  }

  /** `GET /api/service-requests/:id`: the contractor on the job may read it too. */
  request(serviceRequestId: string): Observable<RequestReports> {
    return this.http.get<RequestReports>(`/api/service-requests/${encodeURIComponent(serviceRequestId)}`);
  }

  accept(id: string): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'accept'), {});
  }

  decline(id: string, reason: string): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'decline'), { reason });
  }

  schedule(id: string, visit: ScheduleRequest): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'schedule'), visit);
  }

  arrive(id: string, notes = ''): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'arrive'), { notes });
  }

  complete(id: string, report: CompleteRequest): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'complete'), report);
  }

  update(id: string, change: { findings?: string; notes?: string }): Observable<WorkOrderView> {
    return this.http.patch<WorkOrderView>(this.url(id), change);
  }

  recordPart(id: string, part: RecordPartRequest): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'parts'), part);
  }

  recordLabour(id: string, labour: RecordLabourRequest): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'labour'), labour);
  }

  /** Multipart field "file" with the kind; reports upload progress as it goes. */
  upload(id: string, file: File, kind: AttachmentKind): Observable<UploadProgress> {
    const form = new FormData();
    form.append('kind', kind);
    form.append('file', file, file.name);
    return this.http.post<AttachmentView>(this.url(id, 'attachments'), form, { observe: 'events', reportProgress: true }).pipe(
      map((event: HttpEvent<AttachmentView>): UploadProgress | null => {
        if (event.type === HttpEventType.UploadProgress) return { kind: 'progress', percent: event.total ? Math.round((100 * event.loaded) / event.total) : 0 };
        if (event.type === HttpEventType.Response && event.body) return { kind: 'done', attachment: event.body };
        return null;
      }),
      filter((progress): progress is UploadProgress => progress !== null),
    );
  }

  approveCost(id: string, note?: string): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'cost/approve'), note ? { note } : {});
  }

  disputeCost(id: string, note: string): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'cost/dispute'), { note });
  }

  verify(id: string, note?: string): Observable<WorkOrderView> {
    return this.http.post<WorkOrderView>(this.url(id, 'verify'), note ? { note } : {});
  }

  private url(id: string, action?: string): string {
    const base = `${this.base}/${encodeURIComponent(id)}`;
    return action ? `${base}/${action}` : base;
  }
}
