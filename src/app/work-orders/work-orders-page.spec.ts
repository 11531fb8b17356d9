import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { SEARCH_DEBOUNCE_MS } from '../shared/data-table/filter-bar';
import { configureTableSpec, page, settle, workOrder, type SavedFile } from '../shared/data-table/testing';
import { WORK_ORDER_COLUMNS_KEY, WorkOrdersPage } from './work-orders-page';

describe('WorkOrdersPage', () => {
  let http: HttpTestingController;
  let saved: SavedFile[];

  beforeEach(() => {
    ({ http, saved } = configureTableSpec([
      { path: 'work-orders', pathMatch: 'full', component: WorkOrdersPage },
      { path: 'work-orders/:workOrderId', children: [] },
    ]));
  });
  afterEach(() => http.verify());

  const list = () => http.expectOne((req) => req.url === '/api/work-orders');

  async function open(url = '/work-orders') {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    http.expectOne((req) => req.url === '/api/inventory/properties').flush(page([]));
    return { harness, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
  }

  it('shows jobs soonest due first, overdue ones marked, in the property’s zone', async () => {
    const { harness, loader } = await open();
    const req = list();
    expect(req.request.params.get('sort')).toBe('dueAt');
    expect(req.request.params.get('dir')).toBe('asc');
    req.flush(page([workOrder(1, { overdue: true }), workOrder(2, { state: 'scheduled', priority: 'routine' })]));
    await settle(harness.fixture);
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['overdue'].text).toEqual(['overdue', 'on time']);
    expect(cells['state'].text).toEqual(['dispatched', 'scheduled']);
    expect(cells['dueAt'].text[0]).toBe('Nov 2, 2026, 01:00 PM MST');
    expect(harness.routeNativeElement!.querySelector('.badge[data-tone=overdue]')?.textContent?.trim()).toBe('overdue');
    const sort = await loader.getHarness(MatSortHarness);
    expect(await (await sort.getActiveHeader())?.getLabel()).toBe('Due');
  });

  it('searches after typing stops, and the column choice survives a new visit', async () => {
    localStorage.setItem(WORK_ORDER_COLUMNS_KEY, JSON.stringify(['title', 'contractor', 'no-longer-a-column']));
    const { harness, loader } = await open();
    list().flush(page([workOrder(1)]));
    await settle(harness.fixture);
    const headers = await (await (await loader.getHarness(MatTableHarness)).getHeaderRows())[0].getCellTextByColumnName();
    expect(Object.keys(headers)).toEqual(['title', 'contractor']);

    const search = await loader.getHarness(MatInputHarness.with({ selector: '[type=search]' }));
    await search.setValue('frost');
    await new Promise((resolve) => setTimeout(resolve, SEARCH_DEBOUNCE_MS + 50));
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/work-orders?q=frost');
    expect(list().request.params.get('q')).toBe('frost');

    const menu = await loader.getHarness(MatMenuHarness.with({ triggerText: /Columns/ }));
    await menu.open();
    const items = await menu.getItems();
    expect(items.length).toBe(10);
    await menu.clickItem({ text: /State/ });
    await settle(harness.fixture);
    expect(JSON.parse(localStorage.getItem(WORK_ORDER_COLUMNS_KEY)!)).toEqual(['title', 'contractor', 'state']);
  });

  it('exports with the filters and columns shown, and opens a job', async () => {
    const { harness, loader } = await open('/work-orders?status=overdue&sort=contractor&dir=desc');
    list().flush(page([workOrder(4)]));
    await settle(harness.fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Export CSV/ }))).click();
    const exported = http.expectOne((req) => req.url === '/api/work-orders/export');
    expect(exported.request.params.get('status')).toBe('overdue');
    expect(exported.request.params.get('sort')).toBe('contractor');
    expect(exported.request.params.get('dir')).toBe('desc');
    expect(exported.request.params.get('columns')).toBe('dueAt,title,property,unit,contractor,priority,state,overdue');
    exported.flush(new Blob(['Due\r\n']));
    await settle(harness.fixture);
    expect(saved[0].fileName).toBe('work-orders.csv');

    await (await (await (await loader.getHarness(MatTableHarness)).getRows())[0].host()).click();
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/work-orders/w4');
  });
});
