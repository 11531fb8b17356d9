import { DestroyRef, computed, inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup } from '@angular/forms';
import type { MatPaginator } from '@angular/material/paginator';
import type { MatSort } from '@angular/material/sort';
import { debounceTime, map, merge, type Observable } from 'rxjs';
import type { ArchiveFilter, Page } from '../../../shared/api/inventory';
import { SEARCH_DEBOUNCE_MS } from '../shared/data-table/filter-bar';
import { type PagedTable, sortDirection, sortKey } from './paged-table';

/** What every inventory list filters by: a search and which records (active, archived, all). */
export interface ArchiveListFilters {
  q: string;
  status: ArchiveFilter;
}

export type FilterControls<F> = { [K in keyof F]: FormControl<F[K]> };

/** The query fields every inventory list sends: search, archive filter, sort and page. */
export interface ListQuery<K extends string> {
  q: string | undefined;
  status: ArchiveFilter;
  sort: K;
  direction: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

/** How a list's table fetches: its sort and paginator, the server's sort keys, the API call. */
export interface FilteredListSource<K extends string, T> {
  sort: MatSort;
  paginator: MatPaginator;
  sortKeys: readonly K[];
  defaultSort: K;
  fetch(query: ListQuery<K>): Observable<Page<T>>;
  /** Other events that start again from the first page (another property in the same view). */
  restarts?: Observable<unknown>;
}

/**
 * The filter form of an inventory list with its values as a signal. Create it in a
 * field initialiser (it reads the form through toSignal).
 */
export class ListFilters<F extends ArchiveListFilters> {
  readonly form: FormGroup<FilterControls<F>>;
  readonly values: Signal<F>;
  /** Every filter at its first value: an empty answer then means there is nothing yet. */
  readonly atDefaults: Signal<boolean>;

  private readonly destroyRef = inject(DestroyRef);

  constructor(private readonly defaults: F) {
    const controls = Object.fromEntries(Object.entries(defaults).map(([key, value]) => [key, new FormControl(value, { nonNullable: true })]));
    this.form = new FormGroup(controls as FilterControls<F>);
    this.values = toSignal(this.form.valueChanges.pipe(map(() => this.raw())), { initialValue: this.raw() });
    this.atDefaults = computed(() => {
      const values = this.values();
      return (Object.keys(this.defaults) as (keyof F)[]).every((key) => values[key] === this.defaults[key]);
    });
  }

  /** Filter changes, debounced like the shared filter bar's typing; they start again from page one. */
  changes(): Observable<unknown> {
    return this.form.valueChanges.pipe(debounceTime(SEARCH_DEBOUNCE_MS));
  }

  /** The form's current values (read when a fetch starts, not from the debounced signal). */
  raw(): F {
    return this.form.getRawValue() as F;
  }

  /** Wires a list's table to these filters: a change fetches the first page again. */
  connect<K extends string, T>(table: PagedTable<T>, source: FilteredListSource<K, T>): void {
    table.connect({
      sort: source.sort,
      paginator: source.paginator,
      filters: source.restarts ? merge(this.changes(), source.restarts) : this.changes(),
      query: (sort, paginator) => this.query(sort, paginator, source.sortKeys, source.defaultSort),
      fetch: (query) => source.fetch(query),
      destroyRef: this.destroyRef,
    });
  }

  /** The search, archive filter, sort and page of a list's query; a list adds its own filters. */
  query<K extends string>(sort: MatSort, paginator: MatPaginator, sortKeys: readonly K[], defaultSort: K): ListQuery<K> {
    const { q, status } = this.raw();
    return { q: q.trim() || undefined, status, sort: sortKey(sort, sortKeys, defaultSort), direction: sortDirection(sort), page: paginator.pageIndex, pageSize: paginator.pageSize };
  }
}

/** Nothing at all yet (not merely nothing matching a search): the list shows how to begin instead. */
export function nothingYet(table: PagedTable<unknown>, filters: { atDefaults: Signal<boolean> }): Signal<boolean> {
  return computed(() => table.loaded() && table.total() === 0 && filters.atDefaults());
}
