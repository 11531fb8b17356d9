import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import type { TemperatureUnit } from '../../../../shared/temperature';
import { ThemeService } from '../../core/theme/theme';
import type { ChartPalette, ReadingChartData } from './chart-data';
import { buildChartOptions } from './chart-options';

function readPalette(document: Document): ChartPalette {
  const style = getComputedStyle(document.documentElement);
  const value = (name: string, fallback: string) => style.getPropertyValue(name).trim() || fallback;
  return {
    freshFood: value('--mat-sys-secondary', '#2d7a82'),
    freezer: value('--mat-sys-primary', '#1d4e89'),
    limit: value('--cw-health-warm', '#b8740a'),
    incident: value('--cw-health-no-cooling', '#b23a12'),
    text: value('--mat-sys-on-surface-variant', '#444'),
    grid: value('--mat-sys-outline-variant', '#ccc'),
  };
}

/**
 * Both probes on one time axis with the food-safety limits, min/max envelopes, defrost
 * marks, shaded incidents and the warming forecast. echarts loads with the first chart.
 */
@Component({
  selector: 'cw-reading-chart',
  imports: [NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('./echarts-setup').then((m) => m.default) })],
  template: `<div class="chart" echarts [options]="options()" [autoResize]="true" role="img" [attr.aria-label]="description()"></div>`,
  styleUrl: './reading-chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingChart {
  private readonly document = inject(DOCUMENT);
  private readonly theme = inject(ThemeService);

  readonly data = input.required<ReadingChartData>();
  readonly unit = input<TemperatureUnit>('F');

  protected readonly options = computed(() => {
    this.theme.scheme(); // redraw with the other palette when the theme changes
    return buildChartOptions(this.data(), this.unit(), readPalette(this.document));
  });

  protected readonly description = computed(() => {
    const probes = Object.keys(this.data().probes).map((p) => (p === 'fresh_food' ? 'fresh food' : 'freezer'));
    const incidents = this.data().incidents?.length ?? 0;
    return `Temperature chart of ${probes.join(' and ')}${incidents ? `, with ${incidents} incident${incidents > 1 ? 's' : ''} shaded` : ''}`;
  });
}
