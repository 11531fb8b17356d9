import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { CoverageView } from '../../../shared/api/work-orders';
import { contractor } from './contractor-fixtures';
import { CoverageEditor } from './coverage-editor';
import { configureSpec, page, property, settle } from './testing';

function row(propertyId: string, applianceStyle: CoverageView['applianceStyle'], rank: CoverageView['rank'], n: number): CoverageView {
  return { id: `${propertyId}-${applianceStyle}-${rank}`, propertyId, propertyName: `Linden Court ${propertyId.slice(1)}`, applianceStyle, rank, contractorId: `c${n}`, contractorName: `Frostbell Repairs ${n}` };
}

describe('CoverageEditor', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  async function render(rows: CoverageView[]) {
    const fixture = TestBed.createComponent(CoverageEditor);
    fixture.detectChanges();
    backend.expectOne('/api/contractors').flush([contractor(1), contractor(2), contractor(3, { archivedAt: '2026-01-05T00:00:00.000Z' })]);
    backend.expectOne('/api/coverage').flush(rows);
    const properties = backend.expectOne((req) => req.url === '/api/inventory/properties');
    expect(properties.request.params.get('status')).toBe('active');
    properties.flush(page([property(1), property(2)]));
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const slot = (key: string) => loader.getHarness(MatSelectHarness.with({ selector: `[data-slot="${key}"]` }));
    return { fixture, element: fixture.nativeElement as HTMLElement, loader, slot };
  }

  it('shows a grid of property × appliance style with the primary and backup of each cell', async () => {
    const { element, slot } = await render([row('p1', null, 'primary', 1), row('p1', 'chest-freezer', 'primary', 2), row('p1', 'chest-freezer', 'backup', 1)]);
    const headers = Array.from(element.querySelectorAll('table.grid thead th')).map((th) => th.textContent?.trim());
    expect(headers).toEqual(['Property', 'Every style', 'Top freezer', 'Bottom freezer', 'Side by side', 'Fresh food only', 'Upright freezer', 'Chest freezer']);
    expect(element.querySelectorAll('table.grid tbody tr').length).toBe(2);
    expect(await (await slot('p1|every-style|primary')).getValueText()).toBe('Frostbell Repairs 1');
    expect(await (await slot('p1|chest-freezer|primary')).getValueText()).toBe('Frostbell Repairs 2');
    expect(await (await slot('p1|chest-freezer|backup')).getValueText()).toBe('Frostbell Repairs 1');
    expect(await (await slot('p2|top-freezer|primary')).getValueText()).toBe('');
    // A style without its own row says who the property-wide row sends.
    const topFreezerCell = element.querySelector('[data-slot="p1|top-freezer|primary"]')!.closest('mat-form-field')!;
    expect(topFreezerCell.textContent).toContain('Every-style row: Frostbell Repairs 1');
  });

  it('saves one slot with PUT and shows the answer', async () => {
    const { fixture, slot } = await render([]);
    const select = await slot('p2|upright-freezer|backup');
    await select.clickOptions({ text: 'Frostbell Repairs 2' });
    const call = backend.expectOne('/api/coverage');
    expect(call.request.method).toBe('PUT');
    expect(call.request.body).toEqual({ propertyId: 'p2', applianceStyle: 'upright-freezer', rank: 'backup', contractorId: 'c2' });
    call.flush([row('p2', 'upright-freezer', 'backup', 2)]);
    await settle(fixture);
    expect(await select.getValueText()).toBe('Frostbell Repairs 2');
    // The primary of that cell may not be the same company; archived companies cannot be chosen.
    const primary = await slot('p2|upright-freezer|primary');
    await primary.open();
    const states = await Promise.all((await primary.getOptions()).map(async (option) => `${(await option.getText()).trim()}:${(await option.isDisabled()) ? 'off' : 'on'}`));
    expect(states).toEqual(['Nobody:on', 'Frostbell Repairs 1:on', 'Frostbell Repairs 2:off', 'Frostbell Repairs 3 (archived):off']);
    await primary.close();
  });

  it('clears a slot with "Nobody"', async () => {
    const { slot } = await render([row('p1', null, 'primary', 1)]);
    await (await slot('p1|every-style|primary')).clickOptions({ text: 'Nobody' });
    const call = backend.expectOne('/api/coverage');
    expect(call.request.body).toEqual({ propertyId: 'p1', applianceStyle: null, rank: 'primary', contractorId: null });
    call.flush([]);
  });

  it("puts the select back and shows the server's reason when a save is refused", async () => {
    const { fixture, element, slot } = await render([row('p1', 'top-freezer', 'primary', 1)]);
    const select = await slot('p1|top-freezer|primary');
    await select.clickOptions({ text: 'Frostbell Repairs 2' });
    backend.expectOne('/api/coverage').flush({ error: 'contractor not found' }, { status: 404, statusText: 'Not Found' });
    await settle(fixture);
    expect(await select.getValueText()).toBe('Frostbell Repairs 1');
    const cell = element.querySelector('[data-slot="p1|top-freezer|primary"]')!.closest('cw-coverage-cell')!;
    expect(cell.querySelector('[role="alert"]')?.textContent).toContain('Contractor not found');
  });

  it('sends to the contractors tab when there is nobody to assign', async () => {
    const fixture = TestBed.createComponent(CoverageEditor);
    fixture.detectChanges();
    backend.expectOne('/api/contractors').flush([]);
    backend.expectOne('/api/coverage').flush([]);
    backend.expectOne((req) => req.url === '/api/inventory/properties').flush(page([property(1)]));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('No contractor to assign yet');
  });
});
