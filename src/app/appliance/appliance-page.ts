import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { Subject, catchError, debounceTime, filter, map, merge, of, switchMap, tap } from 'rxjs';
import type { ApplianceDetail } from '../../../shared/api/appliances';
import { formatTemperature } from '../../../shared/temperature';
import { Session } from '../core/auth/session';
import { LiveEvents } from '../core/live/live-events';
import { LiveStatus } from '../core/live/live-status';
import { HEALTH_ICONS, HEALTH_LABELS, HEALTH_MEANINGS, STYLE_LABELS, healthColor } from '../fleet/appliance-words';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { EmptyState } from '../shared/empty-state/empty-state';
import { ApplianceApi } from './appliance-api';
import { ApplianceFacts } from './appliance-facts';
import { DiagnosisCard } from './diagnosis-card';
import { HistoryPanel } from './history-panel';
import { IncidentTimeline } from './incident-timeline';
import { ServiceHistory } from './service-history';

/** Live events about this appliance reload its page this long after the last one. */
export const LIVE_RELOAD_DEBOUNCE_MS = 1_500;

/** One appliance: its history chart, diagnosis, incidents, service history and particulars. */
@Component({
  selector: 'cw-appliance-page',
  imports: [ApplianceFacts, DiagnosisCard, EmptyState, HistoryPanel, IncidentTimeline, LiveStatus, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ServiceHistory, ZonedDatePipe],
  templateUrl: './appliance-page.html',
  styleUrl: './appliance-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AppliancePage {
  private readonly api = inject(ApplianceApi);
  private readonly live = inject(LiveEvents);
  private readonly session = inject(Session);

  /** From the route (`appliances/:id`). */
  readonly id = input.required<string>();

  protected readonly detail = signal<ApplianceDetail | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<{ status: number; message: string } | null>(null);
  protected readonly refreshTick = signal(0);
  protected readonly unit = computed(() => this.session.user()?.temperatureUnit ?? 'F');
  protected readonly healthLabels = HEALTH_LABELS;
  protected readonly healthIcons = HEALTH_ICONS;
  protected readonly healthMeanings = HEALTH_MEANINGS;
  protected readonly styleLabels = STYLE_LABELS;
  protected readonly healthColor = healthColor;

  private readonly reloads = new Subject<{ quiet: boolean }>();

  constructor() {
    const byId = toObservable(this.id).pipe(map(() => ({ quiet: false })));
    const liveForThis = this.live.events$.pipe(
      filter((event) => event.applianceId === this.id()),
      tap(() => this.refreshTick.update((tick) => tick + 1)),
      debounceTime(LIVE_RELOAD_DEBOUNCE_MS),
      map(() => ({ quiet: true })),
    );
    const afterReconnect = this.live.reconnected$.pipe(
      tap(() => this.refreshTick.update((tick) => tick + 1)),
      map(() => ({ quiet: true })),
    );
    merge(byId, liveForThis, afterReconnect, this.reloads)
      .pipe(
        tap(({ quiet }) => quiet || this.loading.set(true)),
        switchMap(() =>
          this.api.detail(this.id()).pipe(
            map((detail) => ({ detail, error: null })),
            catchError((error: { status?: number; message?: string }) => of({ detail: null, error: { status: error.status ?? 0, message: error.message ?? 'unknown error' } })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ detail, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (detail) this.detail.set(detail);
      });
  }

  protected reload(): void {
    this.reloads.next({ quiet: false });
  }

  protected temperature(tempC: number | null): string {
    return formatTemperature(tempC, this.unit());
  }
}
