import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { RouterLink } from '@angular/router';
import { Subject, catchError, debounceTime, filter, map, merge, of, switchMap, tap } from 'rxjs';
import type { Page } from '../../../shared/api/users';
import type { WorkOrderSummary } from '../../../shared/api/work-orders';
import { CAUSES } from '../../../shared/causes';
import type { ApiError } from '../core/http/api-error.interceptor';
import { LiveEvents } from '../core/live/live-events';
import { LiveStatus } from '../core/live/live-status';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { EmptyState } from '../shared/empty-state/empty-state';
import { WorkOrderApi } from '../work-order/work-order-api';
import { PRIORITY_LABELS, STATE_SHORT, windowWords } from '../work-order/work-order-words';

/** Live job changes reload the list this long after the last one. */
export const LIVE_RELOAD_DEBOUNCE_MS = 1_000;
/** More than a technician's open jobs at once; the list says so if there are more. */
export const JOBS_PAGE_SIZE = 100;

/** The contractor's jobs, soonest due first, with what is needed to plan the day; completed ones on request. */
@Component({
  selector: 'cw-jobs-page',
  imports: [EmptyState, LiveStatus, MatButtonModule, MatIconModule, MatProgressBarModule, MatSlideToggleModule, RouterLink, ZonedDatePipe],
  templateUrl: './jobs-page.html',
  styleUrl: './jobs-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobsPage {
  private readonly api = inject(WorkOrderApi);
  private readonly live = inject(LiveEvents);

  protected readonly showCompleted = signal(false);
  protected readonly page = signal<Page<WorkOrderSummary> | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly priorityLabels = PRIORITY_LABELS;
  protected readonly stateShort = STATE_SHORT;
  protected readonly causes = CAUSES;

  /** Soonest due first (the server sorts so too; kept here so a live reload cannot reorder it). */
  protected readonly jobs = computed(() => [...(this.page()?.items ?? [])].sort((a, b) => Date.parse(a.dueAt) - Date.parse(b.dueAt)));
  protected readonly more = computed(() => {
    const page = this.page();
    return page ? Math.max(0, page.total - page.items.length) : 0;
  });

  private readonly reloads = new Subject<{ quiet: boolean }>();

  constructor() {
    const byFilter = toObservable(this.showCompleted).pipe(map(() => ({ quiet: false })));
    const live = this.live.events$.pipe(
      filter((event) => event.type === 'work-order.changed'),
      debounceTime(LIVE_RELOAD_DEBOUNCE_MS),
      map(() => ({ quiet: true })),
    );
    const afterReconnect = this.live.reconnected$.pipe(map(() => ({ quiet: true })));
    merge(byFilter, live, afterReconnect, this.reloads)
      .pipe(
        tap(({ quiet }) => quiet || this.loading.set(true)),
        switchMap(() =>
          this.api.list({ status: this.showCompleted() ? 'completed' : 'open', pageSize: JOBS_PAGE_SIZE }).pipe(
            map((page) => ({ page, error: null })),
            catchError((error: ApiError) => of({ page: null, error: error.message })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ page, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (page) this.page.set(page);
      });
  }

  protected toggle(completed: boolean): void {
    this.page.set(null);
    this.showCompleted.set(completed);
  }

  protected reload(): void {
    this.reloads.next({ quiet: false });
  }

  protected windowsOf(job: WorkOrderSummary): string[] {
    return job.accessWindows.map((window) => windowWords(window, job.property.timeZone));
  }
}
