import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, output } from '@angular/core';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import type { TemperatureUnit } from '../../../../shared/temperature';
import { ThemeService } from '../../core/theme/theme';
import type { ECharts } from 'echarts/core';
import type { ChartPalette, ReadingChartData } from './chart-data';
import { buildChartOptions } from './chart-options';

/**
 * The theme's colours as canvas-ready rgb() values. The custom properties hold
 * `light-dark(…)` and `var(…)` expressions that a canvas cannot parse, so each is resolved
 * by the browser on a hidden probe element first.
 */
export function readPalette(document: Document): ChartPalette {
  const probe = document.createElement('span');
  probe.style.display = 'none';
  document.body.appendChild(probe);
  const value = (name: string, fallback: string) => {
    probe.style.color = fallback;
    probe.style.color = `var(${name}, ${fallback})`;
    return getComputedStyle(probe).color || fallback;
  };
  try {
    return {
      freshFood: value('--cw-probe-fresh-food', '#2f7d3a'),
      freezer: value('--cw-probe-freezer', '#1d4e89'),
      limit: value('--cw-health-warm', '#b8740a'),
      incident: value('--cw-health-no-cooling', '#b23a12'),
      text: value('--mat-sys-on-surface-variant', '#444'),
      grid: value('--mat-sys-outline-variant', '#ccc'),
    };
  } finally {
    probe.remove();
  }
}

/** Quiet time after the last zoom event before the zoom counts as chosen. */
export const ZOOM_SETTLE_MS = 600;

/**
 * Both probes on one time axis with the food-safety limits, min/max envelopes, defrost
 * marks, shaded incidents and the warming forecast. echarts loads with the first chart.
 */
@Component({
  selector: 'cw-reading-chart',
  imports: [NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('./echarts-setup').then((m) => m.default) })],
  template: `<div
    class="chart"
    echarts
    [options]="options()"
    [autoResize]="true"
    (chartInit)="onInit($event)"
    (chartDataZoom)="onZoom()"
    role="img"
    [attr.aria-label]="description()"
  ></div>`,
  styleUrl: './reading-chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingChart {
  private readonly document = inject(DOCUMENT);
  private readonly theme = inject(ThemeService);

  private readonly destroyRef = inject(DestroyRef);

  readonly data = input.required<ReadingChartData>();
  readonly unit = input<TemperatureUnit>('F');
  /** IANA time zone for the time labels (the property's); null: the browser's. */
  readonly timeZone = input<string | null>(null);
  /** The time window the user zoomed to, once they stop zooming (not emitted for the whole range). */
  readonly zoomed = output<{ fromMs: number; toMs: number }>();

  private chart: ECharts | null = null;
  private zoomTimer: ReturnType<typeof setTimeout> | null = null;

  protected readonly options = computed(() => {
    this.theme.scheme(); // redraw with the other palette when the theme changes
    return buildChartOptions(this.data(), this.unit(), readPalette(this.document), this.timeZone());
  });

  constructor() {
    this.destroyRef.onDestroy(() => this.zoomTimer !== null && clearTimeout(this.zoomTimer));
  }

  protected onInit(chart: ECharts): void {
    this.chart = chart;
  }

  /** Debounced: a drag of the slider fires many datazoom events. */
  protected onZoom(): void {
    if (this.zoomTimer !== null) clearTimeout(this.zoomTimer);
    this.zoomTimer = setTimeout(() => this.emitZoom(), ZOOM_SETTLE_MS);
  }

  private emitZoom(): void {
    this.zoomTimer = null;
    const zoom = (this.chart?.getOption() as { dataZoom?: { start?: number; end?: number; startValue?: number; endValue?: number }[] } | undefined)?.dataZoom?.[0];
    if (!zoom || zoom.startValue === undefined || zoom.endValue === undefined) return;
    if ((zoom.start ?? 0) <= 0.5 && (zoom.end ?? 100) >= 99.5) return;
    this.zoomed.emit({ fromMs: zoom.startValue, toMs: zoom.endValue });
  }

  protected readonly description = computed(() => {
    const probes = Object.keys(this.data().probes).map((p) => (p === 'fresh_food' ? 'fresh food' : 'freezer'));
    const incidents = this.data().incidents?.length ?? 0;
    return `Temperature chart of ${probes.join(' and ')}${incidents ? `, with ${incidents} incident${incidents > 1 ? 's' : ''} shaded` : ''}`;
  });
}
