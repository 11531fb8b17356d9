import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCardHarness } from '@angular/material/card/testing';
import type { ServiceHistoryEntry } from '../../../shared/api/appliances';
import { sampleDetail } from './appliance-fixtures';
import { ServiceHistory } from './service-history';

@Component({
  imports: [ServiceHistory],
  template: `<cw-service-history [entries]="entries()" timeZone="America/New_York" />`,
})
class Host {
  readonly entries = signal<ServiceHistoryEntry[] | null>(null);
}

describe('ServiceHistory', () => {
  async function render(entries: ServiceHistoryEntry[] | null) {
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.entries.set(entries);
    await fixture.whenStable();
    return { element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists each work order with cause, contractor, parts, labour and cost', async () => {
    const { element, loader } = await render(sampleDetail().serviceHistory);
    const text = element.textContent ?? '';
    expect(text).toContain('Evaporator fan motor stopped');
    expect(text).toContain('Northwind Repair (demo) · dispatched Nov 2, 2025');
    expect(text).toContain('1 × Evaporator fan motor $89.50');
    expect(text).toContain('Labour 57 min');
    expect(text).toContain('$182.25');
    expect(await (await loader.getHarness(MatCardHarness)).getSubtitleText()).toBe('1 work order · $182.25 in all');
  });

  it('says what will appear when there is no work order yet', async () => {
    expect((await render([])).element.textContent).toContain('No work orders yet');
  });
});
