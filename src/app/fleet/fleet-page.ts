import { ScrollingModule, type CdkVirtualScrollViewport } from '@angular/cdk/scrolling';
import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, afterNextRender, computed, inject, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { Subject, catchError, debounceTime, map, of, switchMap, tap } from 'rxjs';
import type { FleetFilters, FleetOverview } from '../../../shared/api/fleet';
import { HEALTH_STATES } from '../../../shared/domain';
import { Session } from '../core/auth/session';
import { LiveEvents } from '../core/live/live-events';
import { LiveStatus } from '../core/live/live-status';
import { EmptyState } from '../shared/empty-state/empty-state';
import { HEALTH_LABELS, KIND_LABELS, healthColor } from './appliance-words';
import { FleetApi } from './fleet-api';
import { FleetFilterBar } from './fleet-filters';
import { filtersFromParams, paramsFromFilters } from './fleet-filters-url';
import { isNavigationKey, layoutFleet, neighbourCell, type FleetRow } from './fleet-layout';
import { applyLiveEvent } from './fleet-live';
import { UnitTile } from './unit-tile';
import { ZonedDatePipe } from './zoned-date';

/** One row of the virtual scroll: a property band or a row of unit tiles. */
export const ROW_PX = 76;
export const TILE_PX = 104;
export const TILE_GAP_PX = 8;
/** After live events, the overview is reloaded this long after the last one, for exact counts. */
export const LIVE_RELOAD_DEBOUNCE_MS = 2_000;
/** How long a tile that changed live stays marked. */
export const CHANGED_MARK_MS = 10_000;

type Load = { filters: FleetFilters; quiet: boolean };

/** The manager's fleet: every property as a band of unit tiles on the thermal scale, live. */
@Component({
  selector: 'cw-fleet-page',
  imports: [EmptyState, FleetFilterBar, LiveStatus, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ScrollingModule, UnitTile, ZonedDatePipe],
  templateUrl: './fleet-page.html',
  styleUrl: './fleet-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FleetPage {
  private readonly api = inject(FleetApi);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly live = inject(LiveEvents);
  private readonly session = inject(Session);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly destroyRef = inject(DestroyRef);
  private readonly viewport = viewChild<CdkVirtualScrollViewport>('viewport');
  /** The content box the tiles are laid out in; its width sets the number of columns. */
  private readonly body = viewChild.required<ElementRef<HTMLElement>>('body');

  protected readonly rowPx = ROW_PX;
  protected readonly healthStates = HEALTH_STATES;
  protected readonly healthLabels = HEALTH_LABELS;
  protected readonly kindLabels = KIND_LABELS;
  protected readonly healthColor = healthColor;

  protected readonly filters = signal<FleetFilters>({});
  protected readonly overview = signal<FleetOverview | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly changed = signal<ReadonlySet<string>>(new Set());
  private readonly widthPx = signal(0);

  protected readonly unit = computed(() => this.session.user()?.temperatureUnit ?? 'F');
  protected readonly columns = computed(() => Math.max(1, Math.floor((this.widthPx() + TILE_GAP_PX) / (TILE_PX + TILE_GAP_PX))));
  protected readonly layout = computed(() => layoutFleet(this.overview()?.properties ?? [], this.columns()));
  protected readonly filtered = computed(() => {
    const f = this.filters();
    return !!(f.property?.length || f.health?.length || f.style?.length || f.age || f.q);
  });
  protected readonly viewportHeightPx = computed(() => {
    const contentPx = this.layout().rows.length * ROW_PX;
    const windowPx = this.host.nativeElement.ownerDocument.defaultView?.innerHeight ?? 800;
    return Math.max(ROW_PX * 2, Math.min(contentPx, Math.round(windowPx * 0.78)));
  });

  private readonly loads = new Subject<Load>();
  private readonly liveReload = new Subject<void>();

  constructor() {
    this.loads
      .pipe(
        tap(({ quiet }) => quiet || this.loading.set(true)),
        switchMap(({ filters }) =>
          this.api.overview(filters).pipe(
            map((overview) => ({ overview, error: null as string | null })),
            catchError((error: Error) => of({ overview: null, error: error.message })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ overview, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (overview) this.overview.set(overview);
      });
    this.route.queryParamMap.pipe(map(filtersFromParams), takeUntilDestroyed()).subscribe((filters) => {
      this.filters.set(filters);
      this.loads.next({ filters, quiet: false });
    });
    this.watchLive();
    afterNextRender(() => this.watchWidth(this.body().nativeElement));
  }

  protected setFilters(filters: FleetFilters): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: paramsFromFilters(filters), replaceUrl: true });
  }

  protected reload(): void {
    this.loads.next({ filters: this.filters(), quiet: false });
  }

  protected trackRow(_index: number, row: FleetRow): string {
    return row.key;
  }

  protected onKeydown(event: KeyboardEvent): void {
    const cell = (event.target as HTMLElement).closest<HTMLElement>('[data-cell]');
    if (!cell || !isNavigationKey(event.key)) return;
    const next = neighbourCell(this.layout(), Number(cell.dataset['cell']), event.key);
    if (next === null) return;
    event.preventDefault();
    this.focusCell(next);
  }

  /** Focuses a cell, scrolling its row into the virtual viewport first when it is not rendered. */
  private focusCell(cell: number, triesLeft = 10): void {
    const found = this.host.nativeElement.querySelector<HTMLElement>(`[data-cell="${cell}"]`);
    if (found) {
      found.focus();
      return;
    }
    const position = this.layout().cells[cell];
    if (!position || triesLeft === 0) return;
    if (triesLeft === 10) this.viewport()?.scrollToIndex(position.row);
    requestAnimationFrame(() => this.focusCell(cell, triesLeft - 1));
  }

  private watchLive(): void {
    this.live.events$.pipe(takeUntilDestroyed()).subscribe((event) => {
      const current = this.overview();
      const patched = current && applyLiveEvent(current, event);
      if (patched) {
        this.overview.set(patched);
        if (event.applianceId) this.markChanged(event.applianceId);
      }
      this.liveReload.next();
    });
    this.liveReload.pipe(debounceTime(LIVE_RELOAD_DEBOUNCE_MS), takeUntilDestroyed()).subscribe(() => this.loads.next({ filters: this.filters(), quiet: true }));
    this.live.reconnected$.pipe(takeUntilDestroyed()).subscribe(() => this.loads.next({ filters: this.filters(), quiet: true }));
  }

  private markChanged(applianceId: string): void {
    this.changed.update((ids) => new Set([...ids, applianceId]));
    const timer = setTimeout(() => this.changed.update((ids) => new Set([...ids].filter((id) => id !== applianceId))), CHANGED_MARK_MS);
    this.destroyRef.onDestroy(() => clearTimeout(timer));
  }

  private watchWidth(element: HTMLElement): void {
    this.widthPx.set(element.clientWidth);
    const view = element.ownerDocument.defaultView;
    if (!view?.ResizeObserver) return;
    const observer = new view.ResizeObserver((entries) => this.widthPx.set(Math.floor(entries[0]?.contentRect.width ?? element.clientWidth)));
    observer.observe(element);
    this.destroyRef.onDestroy(() => observer.disconnect());
  }
}
