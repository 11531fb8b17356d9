import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { TemperatureUnit } from '../../../../shared/temperature';
import type { ReadingChartData } from './chart-data';
import { ReadingChart } from './reading-chart';

@Component({
  imports: [ReadingChart],
  template: `<cw-reading-chart [data]="data()" [unit]="unit()" />`,
})
class Host {
  readonly data = signal<ReadingChartData>({
    probes: { fresh_food: { points: [[0, 3], [60_000, 3.2]], envelope: null } },
    incidents: [{ startMs: 0, endMs: 60_000, label: 'Door seal' }],
  });
  readonly unit = signal<TemperatureUnit>('C');
}

describe('ReadingChart', () => {
  it('renders an echarts canvas with a description for screen readers', async () => {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
    const chart = (fixture.nativeElement as HTMLElement).querySelector('.chart')!;
    expect(chart.getAttribute('role')).toBe('img');
    expect(chart.getAttribute('aria-label')).toBe('Temperature chart of fresh food, with 1 incident shaded');
    // echarts is imported lazily; wait for it to draw
    for (let i = 0; i < 50 && !chart.querySelector('canvas'); i++) await new Promise((resolve) => setTimeout(resolve, 20));
    expect(chart.querySelector('canvas')).not.toBeNull();
  });
});
