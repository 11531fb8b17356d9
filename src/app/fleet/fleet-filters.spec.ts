import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatChipListboxHarness } from '@angular/material/chips/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { FleetFilters } from '../../../shared/api/fleet';
import { FleetFilterBar, SEARCH_DEBOUNCE_MS } from './fleet-filters';
import { sampleOverview } from './fleet-fixtures';

@Component({
  imports: [FleetFilterBar],
  template: `<cw-fleet-filters [filters]="filters()" [counts]="overview.counts" [propertyOptions]="overview.propertyOptions" (filtersChange)="changes.push($event); filters.set($event)" />`,
})
class Host {
  readonly overview = sampleOverview();
  readonly filters = signal<FleetFilters>({});
  readonly changes: FleetFilters[] = [];
}

describe('FleetFilterBar', () => {
  async function render() {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
    return { fixture, host: fixture.componentInstance, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('offers every health word with its count, and toggles them as a filter', async () => {
    const { host, loader } = await render();
    const listbox = await loader.getHarness(MatChipListboxHarness);
    const chips = await listbox.getChips();
    expect(await Promise.all(chips.map((chip) => chip.getText()))).toEqual(['cold2 appliances', 'drifting1 appliances', 'warm1 appliances', 'no cooling0 appliances', 'silent1 appliances']);
    await listbox.selectChips({ text: /warm/ });
    await listbox.selectChips({ text: /silent/ });
    expect(host.changes.at(-1)).toEqual({ health: ['warm', 'silent'] });
  });

  it('filters by property, style and age', async () => {
    const { host, loader } = await render();
    const selects = await loader.getAllHarnesses(MatSelectHarness);
    expect(selects.length).toBe(3);
    await selects[0]!.open();
    await selects[0]!.clickOptions({ text: 'Birch Court' });
    expect(host.changes.at(-1)?.property).toEqual(['p-birch']);
    await selects[1]!.open();
    await selects[1]!.clickOptions({ text: 'Chest freezer' });
    expect(host.changes.at(-1)).toEqual({ property: ['p-birch'], style: ['chest-freezer'] });
    await selects[2]!.open();
    await selects[2]!.clickOptions({ text: 'Past expected life' });
    expect(host.changes.at(-1)?.age).toBe('past-life');
  });

  it('searches after the typing pauses, and clears every filter at once', async () => {
    const { fixture, host, loader } = await render();
    const input = await loader.getHarness(MatInputHarness.with({ placeholder: '4B or cw-3f2a' }));
    await input.setValue('4d');
    expect(host.changes.length).toBe(0);
    await new Promise((resolve) => setTimeout(resolve, SEARCH_DEBOUNCE_MS + 50));
    expect(host.changes.at(-1)).toEqual({ q: '4d' });
    await fixture.whenStable();
    const clear = await loader.getHarness(MatButtonHarness.with({ text: /Clear filters/ }));
    await clear.click();
    expect(host.changes.at(-1)).toEqual({});
  });
});
