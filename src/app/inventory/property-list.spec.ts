import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { Page, PropertyView } from '../../../shared/api/inventory';
import { PropertyList } from './property-list';
import { configureSpec, page, property, settle } from './testing';

describe('PropertyList', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  const listCall = (): TestRequest => backend.expectOne((req) => req.method === 'GET' && req.url === '/api/inventory/properties');

  async function render(first: Page<PropertyView> | { status: number }) {
    const fixture = TestBed.createComponent(PropertyList);
    fixture.detectChanges();
    const call = listCall();
    expect(call.request.params.get('page')).toBe('0');
    expect(call.request.params.get('status')).toBe('active');
    expect(call.request.params.get('sort')).toBe('name');
    if ('status' in first) call.flush({ error: 'the database is not answering' }, { status: first.status, statusText: 'Server Error' });
    else call.flush(first);
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), root: TestbedHarnessEnvironment.documentRootLoader(fixture) };
  }

  it('lists properties with their city, time zone and counts', async () => {
    const { loader } = await render(page([property(1), property(2, { addressLine2: 'Rear', archivedAt: null, unitCount: 12, applianceCount: 11, sensorCount: 9 })]));
    const table = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Properties"]' }));
    const cells = await table.getCellTextByColumnName();
    expect(cells['name'].text).toEqual(['Linden Court 11 Example Road', 'Linden Court 22 Example Road, Rear']);
    expect(cells['timeZone'].text).toEqual(['America/Chicago', 'America/Chicago']);
    expect(cells['counts'].text).toEqual(['3 · 2 · 1', '12 · 11 · 9']);
  });

  it('asks the server for the next page, a new sort, a search and archived properties', async () => {
    const { fixture, loader } = await render(page([property(1)], 60));
    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    const next = listCall();
    expect(next.request.params.get('page')).toBe('1');
    next.flush(page([property(26)], 60, 1));
    await settle(fixture);

    const [cityHeader] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'City' });
    await cityHeader.click();
    const sorted = listCall();
    expect(sorted.request.params.get('sort')).toBe('city');
    expect(sorted.request.params.get('page')).toBe('0');
    sorted.flush(page([property(1)], 60));
    await settle(fixture);

    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Archived properties' });
    await new Promise((resolve) => setTimeout(resolve, 350)); // the filters are debounced
    const archived = listCall();
    expect(archived.request.params.get('status')).toBe('archived');
    archived.flush(page([]));
    await settle(fixture);

    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="q"]' }))).setValue('linden');
    await new Promise((resolve) => setTimeout(resolve, 350));
    const searched = listCall();
    expect(searched.request.params.get('q')).toBe('linden');
    searched.flush(page([property(1)]));
    await settle(fixture);
  });

  it('says how to begin when there is no property at all', async () => {
    const { fixture } = await render(page([]));
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('No properties yet');
    expect(text).toContain('Import from CSV');
  });

  it("shows the server's message when the list cannot load", async () => {
    const { fixture } = await render({ status: 500 });
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('The database is not answering');
  });

  it('archives from the row menu and reloads the list', async () => {
    const { fixture, loader } = await render(page([property(1)]));
    await (await loader.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for Linden Court 1"]' }))).clickItem({ text: /Archive/ });
    const call = backend.expectOne('/api/inventory/properties/p1/archive');
    expect(call.request.method).toBe('POST');
    call.flush(property(1, { archivedAt: '2026-03-01T00:00:00.000Z' }));
    await settle(fixture);
    listCall().flush(page([]));
    await settle(fixture);
  });

  it('opens the property form to add one', async () => {
    const { root, fixture } = await render(page([property(1)]));
    (fixture.nativeElement as HTMLElement).querySelectorAll('button').forEach((button) => button.textContent?.includes('Add property') && button.click());
    await settle(fixture);
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Add a property');
    await dialog.close();
  });
});
