import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subject, catchError, interval, map, merge, of, startWith, switchMap, tap } from 'rxjs';
import type { ComponentHealth, HealthReport } from '../../../shared/api/health';
import { Session } from '../core/auth/session';
import { HealthApi } from './health-api';

export const STATUS_REFRESH_MS = 15_000;

interface ComponentRow {
  key: string;
  label: string;
  icon: string;
  health: ComponentHealth;
}

type ComponentKey = keyof HealthReport['components'];

/** In the order the readings travel; the ingest card only where the server runs the ingest. */
const LABELS: Record<ComponentKey, { label: string; icon: string }> = {
  server: { label: 'Web server', icon: 'dns' },
  database: { label: 'Database', icon: 'storage' },
  broker: { label: 'Telemetry broker', icon: 'sensors' },
  ingest: { label: 'Reading ingest', icon: 'move_to_inbox' },
};

/** Server, database, broker and ingest status, read from the API and refreshed every 15 s. */
@Component({
  selector: 'cw-status-page',
  imports: [DatePipe, MatButtonModule, MatCardModule, MatIconModule, MatProgressBarModule],
  templateUrl: './status-page.html',
  styleUrl: './status-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusPage {
  private readonly api = inject(HealthApi);
  /** Managers see what runs and why a part is down; everyone else the states. */
  private readonly withDetails = inject(Session).user()?.role === 'manager';
  private readonly refreshNow = new Subject<void>();

  protected readonly report = signal<HealthReport | null>(null);
  protected readonly rows = signal<ComponentRow[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);

  constructor() {
    merge(interval(STATUS_REFRESH_MS).pipe(startWith(0)), this.refreshNow)
      .pipe(
        tap(() => this.loading.set(true)),
        switchMap(() =>
          this.api.report(this.withDetails).pipe(
            map((report) => ({ report, error: null as string | null })),
            catchError((error: Error) => of({ report: null, error: error.message })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ report, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (report) this.show(report);
      });
  }

  protected refresh(): void {
    this.refreshNow.next();
  }

  private show(report: HealthReport): void {
    this.report.set(report);
    const rows: ComponentRow[] = [];
    for (const key of Object.keys(LABELS) as ComponentKey[]) {
      const health = report.components[key];
      if (health) rows.push({ key, ...LABELS[key], health });
    }
    this.rows.set(rows);
  }
}
