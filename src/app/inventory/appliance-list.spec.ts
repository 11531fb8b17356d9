import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { ApplianceList } from './appliance-list';
import { appliance, configureSpec, page, property, settle } from './testing';

describe('ApplianceList', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  const listCall = (): TestRequest => backend.expectOne((req) => req.method === 'GET' && req.url === '/api/inventory/appliances');

  it('lists appliances across properties and filters by property and style on the server', async () => {
    const fixture = TestBed.createComponent(ApplianceList);
    fixture.detectChanges();
    backend.expectOne((req) => req.url === '/api/inventory/properties').flush(page([property(1), property(2)]));
    listCall().flush(page([appliance(1, { sensor: { id: 's1', deviceId: 'cw-abc', intervalSeconds: 300, lastSeenAt: null } }), appliance(2, { style: 'upright-freezer' })]));
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['style'].text).toEqual(['Top freezer', 'Upright freezer']);
    expect(cells['sensor'].text[0]).toBe('cw-abc');
    expect(cells['sensor'].text[1]).toContain('Pair');

    const [propertySelect, styleSelect] = await loader.getAllHarnesses(MatSelectHarness);
    await propertySelect.clickOptions({ text: 'Linden Court 2' });
    await styleSelect.clickOptions({ text: 'Chest freezer' });
    await new Promise((resolve) => setTimeout(resolve, 350));
    const filtered = listCall();
    expect(filtered.request.params.get('propertyId')).toBe('p2');
    expect(filtered.request.params.get('style')).toBe('chest-freezer');
    filtered.flush(page([]));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('No appliance matches.');
  });
});
