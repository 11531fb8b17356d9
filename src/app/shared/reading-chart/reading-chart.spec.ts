import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { getInstanceByDom } from 'echarts/core';
import type { TemperatureUnit } from '../../../../shared/temperature';
import type { ReadingChartData } from './chart-data';
import { ReadingChart, ZOOM_SETTLE_MS, readPalette } from './reading-chart';

@Component({
  imports: [ReadingChart],
  template: `<cw-reading-chart [data]="data()" [unit]="unit()" (zoomed)="zooms.push($event)" />`,
})
class Host {
  readonly zooms: { fromMs: number; toMs: number }[] = [];
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

  it('reports the window the user zoomed to once the zoom settles', async () => {
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.data.set({ probes: { fresh_food: { points: Array.from({ length: 101 }, (_, i) => [i * 60_000, 3] as [number, number]), envelope: null } } });
    await fixture.whenStable();
    const chart = (fixture.nativeElement as HTMLElement).querySelector<HTMLElement>('.chart')!;
    for (let i = 0; i < 50 && !chart.querySelector('canvas'); i++) await new Promise((resolve) => setTimeout(resolve, 20));
    const instance = getInstanceByDom(chart)!;
    instance.dispatchAction({ type: 'dataZoom', start: 20, end: 60 });
    await new Promise((resolve) => setTimeout(resolve, ZOOM_SETTLE_MS + 100));
    expect(fixture.componentInstance.zooms.length).toBe(1);
    const [zoom] = fixture.componentInstance.zooms;
    expect(zoom!.fromMs).toBeCloseTo(20 * 60_000, -3);
    expect(zoom!.toMs).toBeCloseTo(60 * 60_000, -3);
    instance.dispatchAction({ type: 'dataZoom', start: 0, end: 100 }); // back to the whole range: nothing to load
    await new Promise((resolve) => setTimeout(resolve, ZOOM_SETTLE_MS + 100));
    expect(fixture.componentInstance.zooms.length).toBe(1);
  });

  it('hands the canvas plain rgb() colours, resolving light-dark() and var() in the theme', () => {
    const root = document.documentElement;
    root.style.setProperty('--cw-health-no-cooling', 'light-dark(#b23a12, #ff8a5c)');
    root.style.setProperty('--cw-probe-freezer', 'var(--spec-primary)');
    root.style.setProperty('--spec-primary', '#1d4e89');
    try {
      const palette = readPalette(document);
      for (const colour of Object.values(palette)) expect(colour).toMatch(/^rgba?\(/);
      expect(['rgb(178, 58, 18)', 'rgb(255, 138, 92)']).toContain(palette.incident);
      expect(palette.freezer).toBe('rgb(29, 78, 137)');
    } finally {
      for (const name of ['--cw-health-no-cooling', '--cw-probe-freezer', '--spec-primary']) root.style.removeProperty(name);
    }
  });
});
