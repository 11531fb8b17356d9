import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { TestBed } from '@angular/core/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import { LIVE_REFRESH_MS } from '../shared/data-table/server-table';
import { FakeEventSource, configureTableSpec, incident, page, settle, type SavedFile } from '../shared/data-table/testing';
import { INCIDENT_COLUMNS_KEY, IncidentsPage } from './incidents-page';

describe('IncidentsPage', () => {
  let http: HttpTestingController;
  let saved: SavedFile[];

  beforeEach(() => {
    ({ http, saved } = configureTableSpec([
      { path: 'incidents', component: IncidentsPage },
      { path: 'appliances/:id', children: [] },
    ]));
  });
  afterEach(() => http.verify());

  async function open(url = '/incidents') {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    http.expectOne((req) => req.url === '/api/inventory/properties').flush(page([{ id: 'p1', name: 'Linden Court' }]));
    return { harness, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
  }

  const list = (): TestRequest => http.expectOne((req) => req.url === '/api/incidents');

  it('restores sort, page and filters from the address and shows rows in the property’s time zone and the user’s unit', async () => {
    const { harness, loader } = await open('/incidents?sort=severity&dir=asc&page=1&severity=critical&from=2026-11-01&to=2026-11-30');
    const req = list();
    const params = req.request.params;
    expect(params.get('sort')).toBe('severity');
    expect(params.get('dir')).toBe('asc');
    expect(params.get('page')).toBe('1');
    expect(params.get('pageSize')).toBe('25');
    expect(params.get('status')).toBe('open');
    expect(params.get('severity')).toBe('critical');
    // Days in the user's zone (America/Chicago): Nov 1 starts at 05:00 UTC; the last day counts whole.
    expect(params.get('openedFrom')).toBe('2026-11-01T05:00:00.000Z');
    expect(params.get('openedTo')).toBe('2026-12-01T06:00:00.000Z');
    req.flush(page([incident(1)], 30, 1));
    await settle(harness.fixture);

    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getRows();
    const cells = await rows[0].getCellTextByColumnName();
    expect(cells['openedAt']).toBe('Nov 2, 2026, 08:30 AM MST');
    expect(cells['severity']).toBe('critical');
    expect(cells['topCause']).toContain('ompressor');
    const headers = await (await table.getHeaderRows())[0].getCellTextByColumnName();
    expect(headers['minutesAbove4c']).toBe('Time above 40 °F');

    const sort = await loader.getHarness(MatSortHarness);
    const active = await sort.getActiveHeader();
    expect(await active?.getLabel()).toBe('Severity');
    expect(await active?.getSortDirection()).toBe('asc');
    expect(await (await loader.getHarness(MatPaginatorHarness)).getRangeLabel()).toBe('26 – 30 of 30');
  });

  it('writes sorting and paging into the address and fetches again', async () => {
    const { harness, loader } = await open();
    list().flush(page([incident(1), incident(2)], 60));
    await settle(harness.fixture);

    const kind = (await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Kind' }))[0];
    await kind.click();
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/incidents?sort=kind&dir=asc');
    const sorted = list();
    expect(sorted.request.params.get('sort')).toBe('kind');
    sorted.flush(page([incident(1), incident(2)], 60));
    await settle(harness.fixture);

    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/incidents?sort=kind&dir=asc&page=1');
    const next = list();
    expect(next.request.params.get('page')).toBe('1');
    next.flush(page([incident(3)], 60, 1));
    await settle(harness.fixture);
  });

  it('opens the appliance of a row', async () => {
    const { harness, loader } = await open();
    list().flush(page([incident(7)]));
    await settle(harness.fixture);
    // The first cell is a real link, for the keyboard and screen readers.
    expect(harness.routeNativeElement!.querySelector('td a.row-anchor')?.getAttribute('href')).toBe('/appliances/a7');
    const rows = await (await loader.getHarness(MatTableHarness)).getRows();
    await (await rows[0].host()).click();
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/appliances/a7');
  });

  it('hides a column from the column menu, remembers it, and exports the columns shown', async () => {
    const { harness, loader } = await open('/incidents?status=all');
    list().flush(page([incident(1)]));
    await settle(harness.fixture);

    const menu = await loader.getHarness(MatMenuHarness.with({ triggerText: /Columns/ }));
    await menu.open();
    await menu.clickItem({ text: /Probable cause/ });
    await settle(harness.fixture);
    const headers = await (await (await loader.getHarness(MatTableHarness)).getHeaderRows())[0].getCellTextByColumnName();
    expect(Object.keys(headers)).not.toContain('topCause');
    expect(JSON.parse(localStorage.getItem(INCIDENT_COLUMNS_KEY) ?? '[]')).not.toContain('topCause');

    await (await loader.getHarness(MatButtonHarness.with({ text: /Export CSV/ }))).click();
    const exported = http.expectOne((req) => req.url === '/api/incidents/export');
    expect(exported.request.params.get('status')).toBe('all');
    expect(exported.request.params.has('page')).toBeFalse();
    expect(exported.request.params.get('columns')).toBe('openedAt,property,unit,appliance,kind,severity,minutesAbove4c,status,closedAt');
    exported.flush(new Blob(['Opened\r\n'], { type: 'text/csv' }), { headers: { 'Content-Disposition': 'attachment; filename="incidents-2026-12-02.csv"' } });
    await settle(harness.fixture);
    expect(saved.map((file) => file.fileName)).toEqual(['incidents-2026-12-02.csv']);
  });

  it('shows the server’s reason when an export is refused', async () => {
    const { harness, loader } = await open();
    list().flush(page([incident(1)]));
    await settle(harness.fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Export CSV/ }))).click();
    const message = '12,000 rows match, and an export holds at most 10,000: narrow the filters (a date range, a property or a status) and export again.';
    http.expectOne((req) => req.url === '/api/incidents/export').flush(new Blob([JSON.stringify({ error: message })], { type: 'application/json' }), { status: 400, statusText: 'Bad Request' });
    await settle(harness.fixture);
    await new Promise((resolve) => setTimeout(resolve, 50));
    const snackBar = await TestbedHarnessEnvironment.documentRootLoader(harness.fixture).getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe(message);
    expect(saved).toEqual([]);
  });

  it('shows the error with a retry, an empty state that offers to clear filters, and refetches on live incidents', async () => {
    const { harness, loader } = await open('/incidents?kind=power-loss');
    list().flush({ error: 'database unavailable' }, { status: 503, statusText: 'Service Unavailable' });
    await settle(harness.fixture);
    const element = harness.routeNativeElement!;
    expect(element.querySelector('[role=alert]')?.textContent).toContain('Database unavailable');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    list().flush(page([]));
    await settle(harness.fixture);
    expect(element.querySelector('cw-empty-state')?.textContent).toContain('Nothing matches these filters');

    FakeEventSource.last!.send({ type: 'live.hello', atMs: 0, role: 'manager', heartbeatMs: 25_000 });
    FakeEventSource.last!.send({ type: 'incident.opened', atMs: 1, organizationId: 'org-1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1', incident: incident(1) });
    FakeEventSource.last!.send({ type: 'incident.updated', atMs: 2, organizationId: 'org-1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1', incident: incident(1) });
    await new Promise((resolve) => setTimeout(resolve, LIVE_REFRESH_MS + 100));
    const refreshed = list();
    expect(refreshed.request.params.get('kind')).toBe('power-loss');
    refreshed.flush(page([incident(1, { kind: 'power-loss' })]));
    await settle(harness.fixture);
    expect((await (await loader.getHarness(MatTableHarness)).getRows()).length).toBe(1);
  });
});
