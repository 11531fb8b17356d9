import { type DestroyRef, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { MatPaginator } from '@angular/material/paginator';
import type { MatSort } from '@angular/material/sort';
import { type Observable, Subject, catchError, map, merge, of, startWith, switchMap, tap } from 'rxjs';
import type { Page } from '../../../shared/api/inventory';
import { errorMessage } from './messages';

export interface PagedSource<Q, T> {
  sort: MatSort;
  paginator: MatPaginator;
  /** Filter changes: they start again from the first page. */
  filters: Observable<unknown>;
  query(sort: MatSort, paginator: MatPaginator): Q;
  fetch(query: Q): Observable<Page<T>>;
  destroyRef: DestroyRef;
}

/**
 * The state of one server-paged Material table as signals: sort, paginator and filter
 * events merged, each switching to a fresh fetch, with loading and error states.
 */
export class PagedTable<T> {
  readonly rows = signal<T[]>([]);
  readonly total = signal(0);
  readonly loading = signal(true);
  readonly error = signal<string | null>(null);
  /** True once a first answer arrived, so an empty state never flashes before it. */
  readonly loaded = signal(false);
  private readonly reloads = new Subject<void>();

  connect<Q>(source: PagedSource<Q, T>): void {
    const { sort, paginator } = source;
    merge(sort.sortChange, source.filters)
      .pipe(takeUntilDestroyed(source.destroyRef))
      .subscribe(() => (paginator.pageIndex = 0));
    merge(sort.sortChange, paginator.page, source.filters, this.reloads)
      .pipe(
        startWith(null),
        tap(() => this.loading.set(true)),
        map(() => source.query(sort, paginator)),
        switchMap((query) =>
          source.fetch(query).pipe(
            map((page) => ({ page, error: null as string | null })),
            catchError((error: unknown) => of({ page: null, error: errorMessage(error) })),
          ),
        ),
        takeUntilDestroyed(source.destroyRef),
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
}

export function sortDirection(sort: MatSort): 'asc' | 'desc' {
  return sort.direction === 'desc' ? 'desc' : 'asc';
}

/** The active sort column if the server knows it, else the default. */
export function sortKey<K extends string>(sort: MatSort, keys: readonly K[], fallback: K): K {
  return (keys as readonly string[]).includes(sort.active) ? (sort.active as K) : fallback;
}
