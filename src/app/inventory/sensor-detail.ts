import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, forkJoin, map, of, startWith, switchMap } from 'rxjs';
import type { SensorView } from '../../../shared/api/inventory';
import { REJECT_REASONS, isSilent, type RejectReason, type SensorRejectsView } from '../../../shared/api/telemetry';
import { EmptyState } from '../shared/empty-state/empty-state';
import { STYLE_LABELS, intervalLabel } from './labels';
import { errorMessage } from './messages';
import { SensorApi } from './sensor-api';

interface Loaded {
  sensor: SensorView | null;
  rejects: SensorRejectsView | null;
  error: string | null;
  loading: boolean;
}

const LOADING: Loaded = { sensor: null, rejects: null, error: null, loading: true };

const SOURCE_LABELS = { broker: 'Broker', ingest: 'Ingest' } as const;

/**
 * One sensor: where it is, how often it reports and whether it still does, and what the
 * broker and the ingest refused of it (counts per reason and the latest messages), so a
 * manager can tell a sensor with a wrong secret or a broken probe from a quiet one.
 */
@Component({
  selector: 'cw-sensor-detail',
  imports: [DatePipe, EmptyState, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink],
  templateUrl: './sensor-detail.html',
  styleUrls: ['./list.scss', './sensor-detail.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SensorDetail {
  private readonly api = inject(SensorApi);

  /** From the route (`sensors/:sensorId`). */
  readonly sensorId = input.required<string>();

  private readonly loaded = toSignal(
    toObservable(this.sensorId).pipe(
      switchMap((id) =>
        forkJoin({ sensor: this.api.get(id), rejects: this.api.rejects(id) }).pipe(
          map(({ sensor, rejects }): Loaded => ({ sensor, rejects, error: null, loading: false })),
          catchError((error: unknown) => of<Loaded>({ sensor: null, rejects: null, error: errorMessage(error), loading: false })),
          startWith(LOADING),
        ),
      ),
    ),
    { initialValue: LOADING },
  );

  protected readonly sensor = computed(() => this.loaded().sensor);
  protected readonly rejects = computed(() => this.loaded().rejects);
  protected readonly error = computed(() => this.loaded().error);
  protected readonly loading = computed(() => this.loaded().loading);
  /** When a reading last arrived: receipt time, or the reading's own time where no receipt is recorded. */
  protected readonly heardAt = computed(() => {
    const sensor = this.sensor();
    const times = [sensor?.lastHeardAt, sensor?.lastSeenAt].filter((time): time is string => !!time).map(Date.parse);
    return times.length ? Math.max(...times) : null;
  });
  protected readonly silent = computed(() => {
    const sensor = this.sensor();
    return sensor ? isSilent(this.heardAt(), sensor.intervalSeconds, Date.now()) : false;
  });
  /** The newest reading is older than its arrival by more than an interval: a buffer upload, or the demo's replay. */
  protected readonly readingLags = computed(() => {
    const sensor = this.sensor();
    const heardAt = this.heardAt();
    return !!sensor?.lastSeenAt && heardAt !== null && heardAt - Date.parse(sensor.lastSeenAt) > sensor.intervalSeconds * 1000;
  });
  /** Reasons, most frequent first. */
  protected readonly counts = computed(() =>
    Object.entries(this.rejects()?.countsByReason ?? {})
      .map(([reason, count]) => ({ reason: reason as RejectReason, meaning: REJECT_REASONS[reason as RejectReason], count: count ?? 0 }))
      .sort((a, b) => b.count - a.count || a.reason.localeCompare(b.reason)),
  );
  protected readonly total = computed(() => this.counts().reduce((sum, row) => sum + row.count, 0));
  protected readonly styleLabel = (sensor: SensorView) => STYLE_LABELS[sensor.style];
  protected readonly intervalLabel = intervalLabel;
  protected readonly sourceLabel = (source: keyof typeof SOURCE_LABELS) => SOURCE_LABELS[source];
}
