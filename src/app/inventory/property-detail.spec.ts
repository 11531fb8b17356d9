import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { PropertyDetail } from './property-detail';
import { appliance, configureSpec, page, property, settle, unit } from './testing';

describe('PropertyDetail', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  async function render() {
    const fixture = TestBed.createComponent(PropertyDetail);
    fixture.componentRef.setInput('propertyId', 'p1');
    fixture.detectChanges();
    await settle(fixture);
    backend.expectOne('/api/inventory/properties/p1').flush(property(1));
    const units = backend.expectOne((req) => req.url === '/api/inventory/properties/p1/units');
    expect(units.request.params.get('sort')).toBe('label');
    const paired = appliance(1, { sensor: { id: 's1', deviceId: 'cw-paired', intervalSeconds: 300, lastSeenAt: null } });
    units.flush(page([unit(1, [paired]), unit(2, [appliance(2, { style: 'chest-freezer', model: '', serial: '' })]), unit(3)]));
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), root: TestbedHarnessEnvironment.documentRootLoader(fixture) };
  }

  it("shows the property's address, time zone and units with their appliances and sensors", async () => {
    const { fixture, loader } = await render();
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('1 Example Road, Springfield, IL');
    expect(text).toContain('America/Chicago');
    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    expect(cells['label'].text).toEqual(['1AFloor 1', '2AFloor 2', '3AFloor 3']);
    expect(cells['appliances'].text[0]).toContain('cw-paired');
    expect(cells['appliances'].text[1]).toContain('Chest freezer');
    expect(cells['appliances'].text[1]).toContain('Pair sensor');
    expect(cells['appliances'].text[2]).toContain('No appliance recorded');
  });

  it('opens pairing for an appliance without a sensor', async () => {
    const { root, loader } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Pair sensor/ }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Pair a sensor');
    await dialog.close();
  });

  it('archives a unit from its menu and refreshes the units and the counts', async () => {
    const { fixture, loader } = await render();
    await (await loader.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for unit 2A"]' }))).clickItem({ text: /Archive unit/ });
    const call = backend.expectOne('/api/inventory/units/u2/archive');
    expect(call.request.method).toBe('POST');
    call.flush(unit(2, [], { archivedAt: '2026-03-01T00:00:00.000Z' }));
    await settle(fixture);
    backend.expectOne((req) => req.url === '/api/inventory/properties/p1/units').flush(page([unit(1)]));
    backend.expectOne('/api/inventory/properties/p1').flush(property(1, { unitCount: 2 }));
    await settle(fixture);
  });
});
