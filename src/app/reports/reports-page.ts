import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router } from '@angular/router';
import { Subject, catchError, map, of, startWith, switchMap, tap } from 'rxjs';
import type { ReportTable } from '../../../shared/api/reports-constants';
import type { ReportView } from '../../../shared/api/reports';
import { ThemeService } from '../core/theme/theme';
import { PropertyApi } from '../inventory/property-api';
import { EmptyState } from '../shared/empty-state/empty-state';
import { readPalette } from '../shared/reading-chart/reading-chart';
import { PastLifeTable } from './past-life-table';
import { ReportChart } from './report-chart';
import { incidentRateOptions, topCausesOptions, type CauseMetric } from './report-charts';
import { ReportFilterBar, type PropertyOption } from './report-filters';
import { filtersFromParams, paramsFromFilters } from './report-filters-url';
import { causeLabel, formatDuration, formatRate, monthLabel } from './report-format';
import { NO_FILTERS, ReportsApi, type ReportFilters } from './reports-api';
import { SpendTable } from './spend-table';

/** Nothing happened in the range: no incident, request, spend or old appliance to show. */
export function isEmptyReport(report: ReportView): boolean {
  return (
    report.incidentRate.every((month) => month.incidents === 0) &&
    report.responseTimes.requests === 0 &&
    report.spendByProperty.length === 0 &&
    report.pastLife.length === 0
  );
}

/** The manager's reports for a date range and optionally one property, kept in the URL. */
@Component({
  selector: 'cw-reports-page',
  imports: [EmptyState, MatButtonModule, MatButtonToggleModule, MatCardModule, MatIconModule, MatProgressBarModule, PastLifeTable, ReportChart, ReportFilterBar, SpendTable],
  templateUrl: './reports-page.html',
  styleUrl: './reports-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportsPage {
  private readonly api = inject(ReportsApi);
  private readonly propertyApi = inject(PropertyApi);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly document = inject(DOCUMENT);
  private readonly theme = inject(ThemeService);

  protected readonly filters = signal<ReportFilters>(NO_FILTERS);
  protected readonly report = signal<ReportView | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly properties = signal<PropertyOption[]>([]);
  protected readonly causeMetric = signal<CauseMetric>('requests');

  protected readonly duration = formatDuration;
  protected readonly rate = formatRate;
  protected readonly empty = computed(() => {
    const report = this.report();
    return report !== null && isEmptyReport(report);
  });

  private readonly palette = computed(() => {
    this.theme.scheme(); // redraw with the other palette when the theme changes
    return readPalette(this.document);
  });
  protected readonly rateOptions = computed(() => incidentRateOptions(this.report()?.incidentRate ?? [], this.palette()));
  protected readonly causeOptions = computed(() => topCausesOptions(this.report()?.topCauses ?? [], this.causeMetric(), this.palette()));
  protected readonly rateDescription = computed(() => {
    const months = this.report()?.incidentRate ?? [];
    return `Bar chart of incidents per 100 appliances per month: ${months.map((m) => `${monthLabel(m.month)} ${m.per100Appliances ?? 'none in service'}`).join(', ')}`;
  });
  protected readonly causeDescription = computed(() => {
    const causes = this.report()?.topCauses ?? [];
    return `Bar chart of the top causes by ${this.causeMetric() === 'requests' ? 'requests' : 'spend'}: ${causes.map((c) => `${causeLabel(c.cause)} ${c.requests}`).join(', ')}`;
  });

  private readonly retries = new Subject<void>();

  constructor() {
    this.route.queryParamMap
      .pipe(
        map(filtersFromParams),
        tap((filters) => this.filters.set(filters)),
        switchMap((filters) => this.retries.pipe(startWith(undefined), map(() => filters))),
        tap(() => {
          this.loading.set(true);
          this.error.set(null);
        }),
        switchMap((filters) =>
          this.api.report(filters).pipe(
            map((report) => ({ report, error: null as string | null })),
            catchError((error: Error) => of({ report: null, error: error.message })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ report, error }) => {
        this.loading.set(false);
        this.error.set(error);
        this.report.set(report);
      });
    this.propertyApi
      .list({ pageSize: 200, status: 'active' })
      .pipe(catchError(() => of({ items: [] as PropertyOption[] })), takeUntilDestroyed())
      .subscribe((page) => this.properties.set(page.items.map((property) => ({ id: property.id, name: property.name }))));
  }

  protected setFilters(filters: ReportFilters): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: paramsFromFilters(filters), replaceUrl: true });
  }

  protected retry(): void {
    this.retries.next();
  }

  protected csv(table: ReportTable): string {
    return this.api.csvUrl(table, this.filters());
  }
}
