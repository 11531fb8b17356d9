import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar, MatSnackBarModule } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { type Observable, Subject, auditTime, catchError, filter, firstValueFrom, forkJoin, map, merge, of, switchMap, tap } from 'rxjs';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import type { ContractorView, WorkOrderSummary } from '../../../shared/api/work-orders';
import { LiveEvents } from '../core/live/live-events';
import { KIND_LABELS, SEVERITY_LABELS } from '../fleet/appliance-words';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { errorMessage } from '../inventory/messages';
import { LIVE_REFRESH_MS } from '../shared/data-table/server-table';
import { PRIORITY_LABELS, REQUEST_SOURCE_LABELS, REQUEST_STATUS_LABELS, WORK_ORDER_STATE_LABELS, causeTitle } from '../shared/data-table/table-words';
import { RequestActions } from './request-actions';
import { RequestApi } from './request-api';

interface Loaded {
  request: ServiceRequestView;
  workOrders: WorkOrderSummary[];
}

/** One service request for the manager: what, where, why, the tenant's reports, its jobs, and the actions on it. */
@Component({
  selector: 'cw-request-page',
  imports: [MatButtonModule, MatCardModule, MatIconModule, MatProgressBarModule, MatSnackBarModule, RouterLink, ZonedDatePipe],
  providers: [RequestActions],
  templateUrl: './request-page.html',
  styleUrl: './request-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestPage {
  private readonly api = inject(RequestApi);
  private readonly actions = inject(RequestActions);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly live = inject(LiveEvents);
  private readonly reloads = new Subject<void>();

  /** The route's :requestId (component input binding). */
  readonly requestId = input.required<string>();

  protected readonly data = signal<Loaded | null>(null);
  protected readonly loading = signal(true);
  protected readonly loadError = signal<string | null>(null);
  protected readonly actionError = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly request = computed(() => this.data()?.request ?? null);
  protected readonly isOpen = computed(() => this.request()?.status === 'open');
  /** Dispatch is offered while no job is under way. */
  protected readonly canDispatch = computed(() => this.isOpen() && !this.data()?.workOrders.some((w) => ['dispatched', 'accepted', 'scheduled', 'on-site', 'reopened'].includes(w.state)));
  protected readonly words = { priority: PRIORITY_LABELS, status: REQUEST_STATUS_LABELS, source: REQUEST_SOURCE_LABELS, state: WORK_ORDER_STATE_LABELS, kind: KIND_LABELS, severity: SEVERITY_LABELS };
  protected readonly causeTitle = causeTitle;

  constructor() {
    const destroyRef = inject(DestroyRef);
    const liveChanges = merge(this.live.events$, this.live.reconnected$.pipe(map(() => null))).pipe(
      filter((event) => !event || ((event.type === 'service-request.changed' || event.type === 'work-order.changed') && event.serviceRequestId === this.requestId())),
      auditTime(LIVE_REFRESH_MS),
    );
    merge(toObservable(this.requestId), this.reloads, liveChanges)
      .pipe(
        tap(() => this.loading.set(true)),
        switchMap(() =>
          forkJoin({ request: this.api.get(this.requestId()), workOrders: this.api.workOrders(this.requestId()) }).pipe(
            tap(() => this.loadError.set(null)),
            catchError((error: unknown) => {
              this.loadError.set(errorMessage(error));
              return of(null);
            }),
          ),
        ),
        takeUntilDestroyed(destroyRef),
      )
      .subscribe((loaded) => {
        this.loading.set(false);
        if (loaded) this.data.set(loaded);
      });
  }

  protected reload(): void {
    this.reloads.next();
  }

  protected photoUrl(photoId: string, thumbnail: boolean): string {
    return `/api/attachments/${photoId}${thumbnail ? '/thumbnail' : ''}`;
  }

  protected async dispatch(): Promise<void> {
    const request = this.request();
    if (!request) return;
    const contractors = await this.loadOr<ContractorView[]>(this.api.contractors(), []);
    await this.run(this.actions.dispatch(request, contractors), (view) => `Dispatched to ${view.workOrder?.contractorName ?? 'the contractor'}.`);
  }

  protected async cancel(): Promise<void> {
    const request = this.request();
    if (request) await this.run(this.actions.cancel(request), () => 'The request is cancelled.');
  }

  protected async merge(): Promise<void> {
    const request = this.request();
    if (!request) return;
    const others = (await this.loadOr<ServiceRequestView[]>(this.api.openRequestsOf(request.propertyId), [])).filter((r) => r.id !== request.id);
    if (!others.length) {
      this.actionError.set('No other open request of this property to merge into.');
      return;
    }
    await this.run(this.actions.merge(request, others), (into) => `Merged into "${into.title}".`, (into) => void this.router.navigate(['/requests', into.id]));
  }

  protected async reprioritise(): Promise<void> {
    const request = this.request();
    if (request) await this.run(this.actions.reprioritise(request), (view) => `The request is now ${view.priority}.`);
  }

  /** Waits for the dialog, makes the call, shows the server's refusal in words, and reloads. */
  private async run(asked: Promise<Observable<ServiceRequestView> | null>, done: (view: ServiceRequestView) => string, then?: (view: ServiceRequestView) => void): Promise<void> {
    const call = await asked;
    if (!call) return;
    this.actionError.set(null);
    this.busy.set(true);
    try {
      const view = await firstValueFrom(call);
      this.snackBar.open(done(view), 'OK', { duration: 5_000 });
      if (then) then(view);
      else this.reload();
    } catch (error) {
      this.actionError.set(errorMessage(error));
    } finally {
      this.busy.set(false);
    }
  }

  private async loadOr<T>(source: Observable<T>, fallback: T): Promise<T> {
    try {
      return await firstValueFrom(source);
    } catch (error) {
      this.actionError.set(errorMessage(error));
      return fallback;
    }
  }
}
