import { TestBed } from '@angular/core/testing';
import type { MatPaginator } from '@angular/material/paginator';
import type { MatSort } from '@angular/material/sort';
import type { ArchiveFilter } from '../../../shared/api/inventory';
import { SEARCH_DEBOUNCE_MS } from '../shared/data-table/filter-bar';
import { ListFilters, nothingYet } from './list-filters';
import { PagedTable } from './paged-table';

describe('ListFilters', () => {
  const create = () => TestBed.runInInjectionContext(() => new ListFilters({ q: '', style: '', status: 'active' as ArchiveFilter }));
  const sort = (active: string, direction: 'asc' | 'desc' | '') => ({ active, direction }) as MatSort;
  const paginator = { pageIndex: 2, pageSize: 50 } as MatPaginator;

  it('builds one control a filter, starting at its default', () => {
    const filters = create();
    expect(filters.form.getRawValue()).toEqual({ q: '', style: '', status: 'active' });
    expect(filters.atDefaults()).toBeTrue();
  });

  it('is no longer at its defaults once any filter changes, and is again when it goes back', () => {
    const filters = create();
    filters.form.controls.style.setValue('chest-freezer');
    expect(filters.atDefaults()).toBeFalse();
    filters.form.controls.style.setValue('');
    filters.form.controls.status.setValue('archived');
    expect(filters.atDefaults()).toBeFalse();
    filters.form.controls.status.setValue('active');
    expect(filters.atDefaults()).toBeTrue();
  });

  it('sends the trimmed search, the archive filter, a known sort and the page', () => {
    const filters = create();
    filters.form.patchValue({ q: '  linden ', status: 'all' });
    expect(filters.query(sort('city', 'desc'), paginator, ['name', 'city'], 'name')).toEqual({ q: 'linden', status: 'all', sort: 'city', direction: 'desc', page: 2, pageSize: 50 });
  });

  it('leaves out a blank search and falls back to the default sort for a column the server does not sort', () => {
    const filters = create();
    filters.form.controls.q.setValue('   ');
    expect(filters.query(sort('timeZone', ''), paginator, ['name', 'city'], 'name')).toEqual({ q: undefined, status: 'active', sort: 'name', direction: 'asc', page: 2, pageSize: 50 });
  });

  it('reports a burst of typing once, after the debounce', async () => {
    const filters = create();
    const seen: unknown[] = [];
    const subscription = filters.changes().subscribe((value) => seen.push(value));
    filters.form.controls.q.setValue('l');
    filters.form.controls.q.setValue('li');
    expect(seen.length).toBe(0);
    await new Promise((resolve) => setTimeout(resolve, SEARCH_DEBOUNCE_MS + 50));
    expect(seen.length).toBe(1);
    subscription.unsubscribe();
  });

  it('says "nothing yet" only for an empty first answer with every filter at its default', () => {
    const filters = create();
    const table = new PagedTable<string>();
    const empty = TestBed.runInInjectionContext(() => nothingYet(table, filters));
    expect(empty()).withContext('before any answer').toBeFalse();
    table.loaded.set(true);
    expect(empty()).toBeTrue();
    filters.form.controls.q.setValue('x');
    expect(empty()).withContext('nothing matches a search').toBeFalse();
    filters.form.controls.q.setValue('');
    table.total.set(3);
    expect(empty()).toBeFalse();
  });
});
