import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subject, catchError, combineLatest, map, merge, of, switchMap } from 'rxjs';
import type { IncidentView } from '../../../shared/api/monitor';
import type { ApplianceHistory } from '../../../shared/api/telemetry';
import { CAUSES } from '../../../shared/causes';
import type { TemperatureUnit } from '../../../shared/temperature';
import { ApplianceApi } from '../appliance/appliance-api';
import { hasReadings } from '../appliance/history-chart';
import { maxPointsFor, resolutionWords } from '../appliance/history-range';
import type { ApiError } from '../core/http/api-error.interceptor';
import { KIND_LABELS } from '../fleet/appliance-words';
import { formatZoned } from '../fleet/zoned-date';
import type { ReadingChartData } from '../shared/reading-chart/chart-data';
import { ReadingChart } from '../shared/reading-chart/reading-chart';

const HOUR_MS = 3_600_000;

type Loaded = { history: ApplianceHistory; error: null } | { history: null; error: ApiError };

/** The unit's temperatures around the incident of the job (the day before it when there is none). */
@Component({
  selector: 'cw-incident-chart',
  imports: [MatButtonModule, MatCardModule, MatIconModule, MatProgressBarModule, ReadingChart],
  templateUrl: './incident-chart.html',
  styleUrl: './incident-chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IncidentChart {
  private readonly api = inject(ApplianceApi);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  readonly applianceId = input.required<string>();
  readonly fromMs = input<number | null>(null);
  readonly toMs = input<number | null>(null);
  readonly incident = input<IncidentView | null>(null);
  readonly unit = input<TemperatureUnit>('F');
  readonly timeZone = input<string | null>(null);
  /** Bumped by the page when new readings may have arrived. */
  readonly refresh = input(0);

  protected readonly loading = signal(true);
  protected readonly history = signal<ApplianceHistory | null>(null);
  protected readonly error = signal<ApiError | null>(null);
  private readonly retries = new Subject<void>();

  /** The range asked for: the server's incident window, else the last day. */
  protected readonly range = computed(() => {
    const toMs = this.toMs() ?? Date.now();
    return { fromMs: this.fromMs() ?? toMs - 24 * HOUR_MS, toMs };
  });
  protected readonly empty = computed(() => !!this.history() && !hasReadings(this.history()!));
  protected readonly caption = computed(() => {
    const history = this.history();
    const { fromMs, toMs } = this.range();
    const span = `${formatZoned(fromMs, this.timeZone(), 'short')} – ${formatZoned(toMs, this.timeZone(), 'short')}`;
    return history ? `${span} · ${resolutionWords(history)}` : span;
  });
  protected readonly chartData = computed<ReadingChartData | null>(() => {
    const history = this.history();
    if (!history) return null;
    const incident = this.incident();
    const spans = incident
      ? [{ startMs: Math.max(Date.parse(incident.startedAt), this.range().fromMs), endMs: incident.closedAt ? Date.parse(incident.closedAt) : null, label: this.incidentLabel(incident) }]
      : [];
    return { probes: history.probes, incidents: spans };
  });

  constructor() {
    const request = combineLatest([toObservable(this.applianceId), toObservable(this.range), toObservable(this.refresh)]);
    merge(request, this.retries.pipe(map(() => null)))
      .pipe(
        switchMap(() => {
          this.loading.set(true);
          return this.api.history(this.applianceId(), this.range(), maxPointsFor(this.host.nativeElement.clientWidth || 360)).pipe(
            map((history): Loaded => ({ history, error: null })),
            catchError((error: ApiError) => of<Loaded>({ history: null, error })),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((loaded) => {
        this.loading.set(false);
        this.error.set(loaded.error);
        if (loaded.history) this.history.set(loaded.history);
      });
  }

  protected retry(): void {
    this.retries.next();
  }

  private incidentLabel(incident: IncidentView): string {
    return incident.topCause ? `${KIND_LABELS[incident.kind]}: ${CAUSES[incident.topCause].title.toLowerCase()}` : KIND_LABELS[incident.kind];
  }
}
