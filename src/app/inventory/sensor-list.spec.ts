import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { SensorList } from './sensor-list';
import { configureSpec, page, sensor, settle } from './testing';

describe('SensorList', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  const listCall = (): TestRequest => backend.expectOne((req) => req.method === 'GET' && req.url === '/api/inventory/sensors');

  async function render() {
    const fixture = TestBed.createComponent(SensorList);
    fixture.detectChanges();
    listCall().flush(page([sensor(1, { lastSeenAt: '2026-03-01T12:00:00.000Z' }), sensor(2, { intervalSeconds: 60 })]));
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), root: TestbedHarnessEnvironment.documentRootLoader(fixture) };
  }

  it('lists sensors with where they sit, how often they report and when they last did', async () => {
    const { loader } = await render();
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['deviceId'].text).toEqual(['cw-000000000001', 'cw-000000000002']);
    expect(cells['place'].text[0]).toBe('Linden Court 1 · 1A Top freezer');
    expect(cells['interval'].text).toEqual(['every 5 min', 'every 1 min']);
    expect(cells['lastSeenAt'].text[1]).toBe('never');
  });

  it('sorts by last report on the server', async () => {
    const { fixture, loader } = await render();
    const [header] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Last report' });
    await header.click();
    const call = listCall();
    expect(call.request.params.get('sort')).toBe('lastSeenAt');
    call.flush(page([]));
    await settle(fixture);
  });

  it('issues a new secret and shows it once in a dialog', async () => {
    const { fixture, loader, root } = await render();
    await (await loader.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for sensor cw-000000000001"]' }))).clickItem({ text: /New secret/ });
    const call = backend.expectOne('/api/inventory/sensors/s1/secret');
    expect(call.request.method).toBe('POST');
    call.flush({ sensor: sensor(1), deviceId: 'cw-000000000001', secret: 'bmV3LXNwZWMtc2VjcmV0LWZvci10ZXN0aW5nLW9ubHk' });
    await settle(fixture);
    listCall().flush(page([sensor(1)]));
    await settle(fixture);
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('New secret for cw-000000000001');
    expect(document.querySelector('[data-field="secret"]')?.textContent).toBe('bmV3LXNwZWMtc2VjcmV0LWZvci10ZXN0aW5nLW9ubHk');
    await dialog.close();
  });
});
