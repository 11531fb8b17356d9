import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { Subject, catchError, debounceTime, filter, map, merge, of, switchMap, tap } from 'rxjs';
import type { WorkOrderView } from '../../../shared/api/work-orders';
import { Session } from '../core/auth/session';
import type { ApiError } from '../core/http/api-error.interceptor';
import { LiveEvents } from '../core/live/live-events';
import { LiveStatus } from '../core/live/live-status';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { EmptyState } from '../shared/empty-state/empty-state';
import { CostReview } from './cost-review';
import { EventLog } from './event-log';
import { IncidentChart } from './incident-chart';
import { JobActions } from './job-actions';
import { JobCosts } from './job-costs';
import { JobDiagnosis } from './job-diagnosis';
import { JobNotes } from './job-notes';
import { JobPhotos } from './job-photos';
import { JobPlace } from './job-place';
import { SafetyCautions } from './safety-cautions';
import { TenantReports } from './tenant-reports';
import { WorkOrderApi } from './work-order-api';
import { PRIORITY_LABELS, RECORDABLE_STATES, STATE_LABELS } from './work-order-words';

/** Live events about this job reload it this long after the last one. */
export const LIVE_RELOAD_DEBOUNCE_MS = 1_000;

/**
 * One work order: for the contractor on a phone, everything needed on site and the next
 * step; for the manager on a desktop, everything recorded and the cost decision.
 */
@Component({
  selector: 'cw-work-order-page',
  imports: [
    CostReview,
    EmptyState,
    EventLog,
    IncidentChart,
    JobActions,
    JobCosts,
    JobDiagnosis,
    JobNotes,
    JobPhotos,
    JobPlace,
    LiveStatus,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    RouterLink,
    SafetyCautions,
    TenantReports,
    ZonedDatePipe,
  ],
  templateUrl: './work-order-page.html',
  styleUrl: './work-order-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkOrderPage {
  private readonly api = inject(WorkOrderApi);
  private readonly live = inject(LiveEvents);
  private readonly session = inject(Session);

  /** From the route (`work-orders/:workOrderId`). */
  readonly workOrderId = input.required<string>();

  protected readonly job = signal<WorkOrderView | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<ApiError | null>(null);
  protected readonly chartTick = signal(0);
  protected readonly stateLabels = STATE_LABELS;
  protected readonly priorityLabels = PRIORITY_LABELS;
  protected readonly isContractor = computed(() => this.session.role() === 'contractor');
  protected readonly unit = computed(() => this.session.user()?.temperatureUnit ?? 'F');
  protected readonly back = computed(() => (this.isContractor() ? { link: '/jobs', label: 'My jobs' } : { link: '/work-orders', label: 'Work orders' }));
  protected readonly recordable = computed(() => {
    const job = this.job();
    return !!job && RECORDABLE_STATES.includes(job.state);
  });

  private readonly reloads = new Subject<{ quiet: boolean }>();

  constructor() {
    const byId = toObservable(this.workOrderId).pipe(map(() => ({ quiet: false })));
    const liveForThis = this.live.events$.pipe(
      filter((event) => (event.type === 'work-order.changed' && event.workOrderId === this.workOrderId()) || (!!event.applianceId && event.applianceId === this.job()?.applianceId)),
      tap((event) => event.type !== 'work-order.changed' && this.chartTick.update((tick) => tick + 1)),
      filter((event) => event.type === 'work-order.changed'),
      debounceTime(LIVE_RELOAD_DEBOUNCE_MS),
      map(() => ({ quiet: true })),
    );
    const afterReconnect = this.live.reconnected$.pipe(map(() => ({ quiet: true })));
    merge(byId, liveForThis, afterReconnect, this.reloads)
      .pipe(
        tap(({ quiet }) => quiet || this.loading.set(true)),
        switchMap(() =>
          this.api.get(this.workOrderId()).pipe(
            map((job) => ({ job, error: null })),
            catchError((error: ApiError) => of({ job: null, error })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ job, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (job) this.job.set(job);
      });
  }

  protected reload(quiet = false): void {
    this.reloads.next({ quiet });
  }

  /** An action answered with the job as it is now. */
  protected changed(job: WorkOrderView): void {
    this.error.set(null);
    this.job.set(job);
  }
}
