import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';

/** One report chart; echarts (bars only) loads with the first one. */
@Component({
  selector: 'cw-report-chart',
  imports: [NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('./reports-echarts').then((m) => m.default) })],
  template: `<div class="chart" echarts [options]="options()" [autoResize]="true" role="img" [attr.aria-label]="description()"></div>`,
  styles: `
    :host {
      display: block;
    }
    .chart {
      width: 100%;
      height: 280px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportChart {
  readonly options = input.required<EChartsCoreOption>();
  /** What the chart shows, in words, for screen readers (the tables and CSV carry the figures). */
  readonly description = input.required<string>();
}
