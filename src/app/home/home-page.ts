import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subject, catchError, debounceTime, map, merge, of, startWith, switchMap, tap } from 'rxjs';
import type { TenantHomeView } from '../../../shared/api/tenant';
import { Session } from '../core/auth/session';
import { LiveEvents } from '../core/live/live-events';
import { LiveStatus } from '../core/live/live-status';
import { errorMessage } from '../inventory/messages';
import { EmptyState } from '../shared/empty-state/empty-state';
import { ApplianceStatus } from './appliance-status';
import { FoodSafetyCard } from './food-safety-card';
import { ReportForm } from './report-form';
import { RequestProgress } from './request-progress';
import { TenantHomeApi } from './tenant-home-api';

/** After live events the page reloads this long after the last one, so a burst is one fetch. */
export const LIVE_RELOAD_DEBOUNCE_MS = 1_000;

/** The tenant's page: each appliance's status, food-safety guidance, repair progress and the report form. */
@Component({
  selector: 'cw-home-page',
  imports: [ApplianceStatus, EmptyState, FoodSafetyCard, LiveStatus, MatButtonModule, MatIconModule, MatProgressBarModule, ReportForm, RequestProgress],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  private readonly api = inject(TenantHomeApi);
  private readonly session = inject(Session);
  private readonly live = inject(LiveEvents);
  private readonly reloads = new Subject<{ quiet: boolean }>();

  protected readonly home = signal<TenantHomeView | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly loadedAtMs = signal(Date.now());
  protected readonly unit = computed(() => this.session.user()?.temperatureUnit ?? 'F');
  protected readonly timeZone = computed(() => this.session.user()?.timeZone ?? null);

  constructor() {
    const liveChanges = this.live.events$.pipe(debounceTime(LIVE_RELOAD_DEBOUNCE_MS));
    merge(this.reloads, liveChanges.pipe(map(() => ({ quiet: true }))), this.live.reconnected$.pipe(map(() => ({ quiet: true }))))
      .pipe(
        startWith({ quiet: false }),
        tap(({ quiet }) => quiet || this.loading.set(true)),
        switchMap(() => this.api.home().pipe(catchError((error: unknown) => of(errorMessage(error))))),
        takeUntilDestroyed(),
      )
      .subscribe((answer) => {
        this.loading.set(false);
        if (typeof answer === 'string') {
          this.error.set(answer);
          return;
        }
        this.error.set(null);
        this.home.set(answer);
        this.loadedAtMs.set(Date.now());
      });
  }

  protected reload(): void {
    this.reloads.next({ quiet: false });
  }

  /** A sent report changes the open request: show it. */
  protected reportSent(): void {
    this.reloads.next({ quiet: true });
  }
}
