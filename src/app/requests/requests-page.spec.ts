import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { LIVE_REFRESH_MS } from '../shared/data-table/server-table';
import { FakeEventSource, configureTableSpec, page, request, settle } from '../shared/data-table/testing';
import { RequestsPage } from './requests-page';

describe('RequestsPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    ({ http } = configureTableSpec([
      { path: 'requests', component: RequestsPage },
      { path: 'requests/:requestId', children: [] },
    ]));
  });
  afterEach(() => http.verify());

  const list = () => http.expectOne((req) => req.url === '/api/service-requests');

  async function open(url = '/requests') {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    http.expectOne((req) => req.url === '/api/inventory/properties').flush(page([{ id: 'p1', name: 'Linden Court' }, { id: 'p2', name: 'Birch Row' }]));
    return { harness, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
  }

  it('lists requests with where they are and who works them, newest first by default', async () => {
    const { harness, loader } = await open();
    const req = list();
    expect(req.request.params.get('sort')).toBe('openedAt');
    expect(req.request.params.get('dir')).toBe('desc');
    expect(req.request.params.get('status')).toBe('open');
    const dispatched = request(1, { progress: 'dispatched', workOrder: { id: 'w1', state: 'dispatched', contractorName: 'Frostline Repair', scheduledStartAt: null, scheduledEndAt: null, dueAt: '2026-11-02T20:00:00.000Z' } });
    req.flush(page([dispatched, request(2, { priority: 'routine', source: 'tenant' })], 2));
    await settle(harness.fixture);
    const rows = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(rows['contractor'].text).toEqual(['Frostline Repair', '—']);
    expect(rows['unit'].text).toEqual(['2B', '2B']);
    expect(rows['openedAt'].text[0]).toBe('Nov 2, 2026, 09:00 AM MST');
    expect(rows['priority'].text).toEqual(['urgent', 'routine']);
    expect(await (await loader.getHarness(MatPaginatorHarness)).getRangeLabel()).toBe('1 – 2 of 2');
  });

  it('filters by property and priority through the address, from the first page', async () => {
    const { harness, loader } = await open('/requests?page=2');
    list().flush(page([request(1)], 80, 2));
    await settle(harness.fixture);
    const selects = await loader.getAllHarnesses(MatSelectHarness);
    // Status, Property, Priority, Opened by.
    await selects[1].open();
    await selects[1].clickOptions({ text: 'Birch Row' });
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/requests?propertyId=p2');
    const byProperty = list();
    expect(byProperty.request.params.get('propertyId')).toBe('p2');
    expect(byProperty.request.params.get('page')).toBe('0');
    byProperty.flush(page([request(1)], 1));
    await settle(harness.fixture);

    await selects[2].open();
    await selects[2].clickOptions({ text: 'Urgent' });
    await settle(harness.fixture);
    expect(list().request.params.get('priority')).toBe('urgent');
  });

  it('sorts by priority and opens a request; refetches when a request changes live', async () => {
    const { harness, loader } = await open();
    list().flush(page([request(3)]));
    await settle(harness.fixture);
    await (await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Priority' }))[0].click();
    await settle(harness.fixture);
    expect(list().request.params.get('sort')).toBe('priority');

    FakeEventSource.last!.send({ type: 'live.hello', atMs: 0, role: 'manager', heartbeatMs: 25_000 });
    FakeEventSource.last!.send({ type: 'service-request.changed', atMs: 1, organizationId: 'org-1', propertyId: 'p1', unitId: 'u1', applianceId: 'a3', serviceRequestId: 'r3', status: 'open', change: 'dispatched' });
    await new Promise((resolve) => setTimeout(resolve, LIVE_REFRESH_MS + 100));
    list().flush(page([request(3)]));
    await settle(harness.fixture);

    await (await (await (await loader.getHarness(MatTableHarness)).getRows())[0].host()).click();
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/requests/r3');
  });
});
