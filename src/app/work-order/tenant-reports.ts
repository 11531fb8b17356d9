import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { catchError, map, of, switchMap } from 'rxjs';
import { SYMPTOMS, type Symptom } from '../../../shared/api/tenant';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { WorkOrderApi, type RequestReports } from './work-order-api';

/** What the request says in words, and the tenant's reports with their photos. Shown only when there is something. */
@Component({
  selector: 'cw-tenant-reports',
  imports: [MatCardModule, MatIconModule, ZonedDatePipe],
  templateUrl: './tenant-reports.html',
  styleUrl: './tenant-reports.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TenantReports {
  private readonly api = inject(WorkOrderApi);

  readonly serviceRequestId = input.required<string>();
  readonly timeZone = input<string | null>(null);

  protected readonly request = signal<RequestReports | null>(null);
  protected readonly failed = signal(false);
  protected readonly reports = computed(() =>
    (this.request()?.reports ?? []).map((report) => ({
      ...report,
      symptomWords: report.symptoms.map((code) => SYMPTOMS[code as Symptom] ?? code).join('; '),
      photos: report.photoIds.map((id) => ({ url: `/api/attachments/${id}`, thumbnailUrl: `/api/attachments/${id}/thumbnail` })),
    })),
  );
  protected readonly hasContent = computed(() => !!this.request()?.description || this.reports().length > 0);

  constructor() {
    toObservable(this.serviceRequestId)
      .pipe(
        switchMap((id) => this.api.request(id).pipe(map((request) => ({ request, failed: false })), catchError(() => of({ request: null, failed: true })))),
        takeUntilDestroyed(),
      )
      .subscribe(({ request, failed }) => {
        this.request.set(request);
        this.failed.set(failed);
      });
  }
}
