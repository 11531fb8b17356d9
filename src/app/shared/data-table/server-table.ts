import { HttpClient, HttpParams } from '@angular/common/http';
import { DestroyRef, computed, inject, signal, type Signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';
import { ActivatedRoute, Router, type ParamMap } from '@angular/router';
import { Subject, auditTime, catchError, distinctUntilChanged, filter, map, merge, of, switchMap, tap } from 'rxjs';
import type { LiveEventType } from '../../../../shared/api/live';
import type { Page } from '../../../../shared/api/users';
import { LiveEvents } from '../../core/live/live-events';
import { errorMessage } from '../../inventory/messages';
import { PAGE_SIZES, type TableState } from './table-types';

export interface ServerTableConfig {
  /** The list's API path, e.g. /api/incidents; its export is `${path}/export`. */
  path: string;
  sortKeys: readonly string[];
  defaultSort: string;
  defaultDir: 'asc' | 'desc';
  defaultPageSize?: number;
  /** URL keys of the filters, with the value each has when the URL leaves it out. */
  filters: Readonly<Record<string, string>>;
  /** Live events after which the rows are fetched again. */
  liveTypes: readonly LiveEventType[];
  /** The URL's filters as the API's parameters (days to instants and the like). */
  apiFilters?(filters: Readonly<Record<string, string>>): Record<string, string | undefined>;
}

/** Live changes come in bursts (an incident and its request together): one refetch per second at most. */
export const LIVE_REFRESH_MS = 1_000;

const sameState = (a: TableState, b: TableState) => JSON.stringify(a) === JSON.stringify(b);

/**
 * A server-paged, server-sorted table whose state lives in the page's URL (so a link or
 * the back button restores it): every change navigates, every URL change fetches, and
 * the live feed refetches the rows shown. Create one in a component's field initialiser.
 */
export class ServerTable<T> {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly live = inject(LiveEvents);
  private readonly reloads = new Subject<void>();

  readonly state: Signal<TableState>;
  readonly rows = signal<T[]>([]);
  readonly total = signal(0);
  readonly loading = signal(true);
  readonly error = signal<string | null>(null);
  /** True once a first answer arrived, so an empty state never flashes before it. */
  readonly loaded = signal(false);
  /** Whether any filter differs from its default (the empty state then offers to clear them). */
  readonly filtered = computed(() => Object.entries(this.config.filters).some(([key, value]) => (this.state().filters[key] ?? '') !== value));
  readonly pageSizes = PAGE_SIZES;

  constructor(readonly config: ServerTableConfig) {
    const destroyRef = inject(DestroyRef);
    this.state = toSignal(this.route.queryParamMap.pipe(map((params) => this.parse(params))), { initialValue: this.parse(this.route.snapshot.queryParamMap) });
    const urlChanges = this.route.queryParamMap.pipe(
      map((params) => this.parse(params)),
      distinctUntilChanged(sameState),
    );
    const liveChanges = merge(this.live.events$.pipe(filter((event) => config.liveTypes.includes(event.type))), this.live.reconnected$).pipe(auditTime(LIVE_REFRESH_MS));
    merge(urlChanges, merge(this.reloads, liveChanges).pipe(map(() => this.state())))
      .pipe(
        // The route's query parameters emit the current ones at once: that is the first fetch.
        tap(() => this.loading.set(true)),
        switchMap((state) =>
          this.http.get<Page<T>>(config.path, { params: this.params(state, true) }).pipe(
            map((page) => ({ page, error: null as string | null })),
            catchError((error: unknown) => of({ page: null, error: errorMessage(error) })),
          ),
        ),
        takeUntilDestroyed(destroyRef),
      )
      .subscribe(({ page, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (!page) return;
        this.rows.set(page.items);
        this.total.set(page.total);
        this.loaded.set(true);
      });
  }

  reload(): void {
    this.reloads.next();
  }

  setSort(sort: Sort): void {
    const active = sort.direction ? sort.active : this.config.defaultSort;
    const dir = sort.direction || this.config.defaultDir;
    this.navigate({ sort: active === this.config.defaultSort ? null : active, dir: dir === this.config.defaultDir ? null : dir, page: null });
  }

  setPage(event: PageEvent): void {
    const pageSize = event.pageSize === this.defaultPageSize ? null : event.pageSize;
    this.navigate({ page: event.pageIndex || null, pageSize });
  }

  /** A filter change starts again from the first page; typing replaces the history entry. */
  setFilter(key: string, value: string, replaceUrl = false): void {
    this.navigate({ [key]: value === this.config.filters[key] ? null : value, page: null }, replaceUrl);
  }

  clearFilters(): void {
    this.navigate({ ...Object.fromEntries(Object.keys(this.config.filters).map((key) => [key, null])), page: null });
  }

  /** The current filters and sort as API parameters, for the export (no paging). */
  exportParams(): HttpParams {
    return this.params(this.state(), false);
  }

  private get defaultPageSize(): number {
    return this.config.defaultPageSize ?? 25;
  }

  private params(state: TableState, paged: boolean): HttpParams {
    const filters = this.config.apiFilters ? this.config.apiFilters(state.filters) : state.filters;
    let params = new HttpParams().set('sort', state.sort).set('dir', state.dir);
    if (paged) params = params.set('page', state.page).set('pageSize', state.pageSize);
    for (const [key, value] of Object.entries(filters)) if (value) params = params.set(key, value);
    return params;
  }

  private parse(params: ParamMap): TableState {
    const sort = params.get('sort') ?? '';
    const dir = params.get('dir');
    const page = Number(params.get('page') ?? 0);
    const pageSize = Number(params.get('pageSize') ?? this.defaultPageSize);
    const filters: Record<string, string> = {};
    for (const [key, fallback] of Object.entries(this.config.filters)) filters[key] = params.get(key) ?? fallback;
    return {
      sort: this.config.sortKeys.includes(sort) ? sort : this.config.defaultSort,
      dir: dir === 'asc' || dir === 'desc' ? dir : this.config.defaultDir,
      page: Number.isInteger(page) && page >= 0 ? page : 0,
      pageSize: (PAGE_SIZES as readonly number[]).includes(pageSize) ? pageSize : this.defaultPageSize,
      filters,
    };
  }

  private navigate(queryParams: Record<string, string | number | null>, replaceUrl = false): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams, queryParamsHandling: 'merge', replaceUrl });
  }
}
