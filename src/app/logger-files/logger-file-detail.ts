import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, firstValueFrom, map, of, switchMap, tap } from 'rxjs';
import { CAUSES, SAFETY_CAUTIONS } from '../../../shared/causes';
import type { ApplianceView } from '../../../shared/api/inventory';
import type { AttachLoggerFileResult, LoggerFileView, LoggerFinding } from '../../../shared/api/logger-files';
import type { CauseCode } from '../../../shared/domain';
import { formatTemperature, type TemperatureUnit } from '../../../shared/temperature';
import { Session } from '../core/auth/session';
import { AppliancePicker } from '../inventory/appliance-picker';
import { STYLE_LABELS } from '../inventory/labels';
import { errorMessage } from '../inventory/messages';
import { ReadingChart } from '../shared/reading-chart/reading-chart';
import { LoggerFilesApi } from './logger-files-api';
import { COMPARTMENT_LABELS, HEALTH_LABELS, KIND_LABELS, SEVERITY_LABELS, chartDataOf } from './logger-words';

/** One analysed logger file: its chart, the engine's findings, and adding it to an appliance's history. */
@Component({
  selector: 'cw-logger-file-detail',
  imports: [AppliancePicker, DecimalPipe, MatButtonModule, MatIconModule, MatProgressBarModule, ReadingChart, RouterLink],
  templateUrl: './logger-file-detail.html',
  styleUrls: ['../inventory/list.scss', './logger-file-detail.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoggerFileDetail {
  private readonly api = inject(LoggerFilesApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);

  /** From the route (`logger-files/:loggerFileId`). */
  readonly loggerFileId = input.required<string>();

  protected readonly file = signal<LoggerFileView | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly target = signal<ApplianceView | null>(null);
  protected readonly attaching = signal(false);
  protected readonly attachResult = signal<AttachLoggerFileResult | null>(null);
  protected readonly attachError = signal<string | null>(null);
  protected readonly confirmingDelete = signal(false);
  protected readonly cautions = SAFETY_CAUTIONS;

  protected readonly unit = computed<TemperatureUnit>(() => this.session.user()?.temperatureUnit ?? 'F');
  private readonly timeZone = computed(() => this.session.user()?.timeZone ?? undefined);
  protected readonly chartData = computed(() => {
    const file = this.file();
    return file ? chartDataOf(file.chart, file.analysis.findings) : null;
  });
  protected readonly chartNote = computed(() => {
    const file = this.file();
    if (!file) return '';
    const shown = Object.values(file.chart).reduce((sum, probe) => sum + (probe?.points.length ?? 0), 0);
    const all = Object.values(file.chart).reduce((sum, probe) => sum + (probe?.readings ?? 0), 0);
    return shown < all ? `The chart draws ${shown.toLocaleString()} of ${all.toLocaleString()} values (largest-triangle downsampling); the engine read every one.` : '';
  });

  constructor() {
    toObservable(this.loggerFileId)
      .pipe(
        tap(() => this.loading.set(true)),
        switchMap((id) =>
          this.api.get(id).pipe(
            map((file) => ({ file, error: null as string | null })),
            catchError((error: unknown) => of({ file: null, error: errorMessage(error) })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ file, error }) => {
        this.loading.set(false);
        this.file.set(file);
        this.error.set(error);
      });
  }

  protected styleLabel(file: LoggerFileView): string {
    return STYLE_LABELS[file.style];
  }

  protected kindLabel(finding: LoggerFinding): string {
    return `${KIND_LABELS[finding.kind]}, ${COMPARTMENT_LABELS[finding.compartment]}`;
  }

  protected severityLabel(finding: LoggerFinding): string {
    return SEVERITY_LABELS[finding.severity];
  }

  protected healthLabel(file: LoggerFileView): string {
    return HEALTH_LABELS[file.analysis.summary.health_at_end];
  }

  protected causeTitle(code: CauseCode): string {
    return CAUSES[code]?.title ?? code;
  }

  protected temperature(tempC: number | null): string {
    return formatTemperature(tempC, this.unit());
  }

  /** Dates in the person's own time zone (their profile), else the browser's. */
  protected when(iso: string | null): string {
    if (!iso) return '—';
    return new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short', timeZone: this.timeZone() }).format(new Date(iso));
  }

  protected async attach(file: LoggerFileView): Promise<void> {
    const target = this.target() ?? null;
    const applianceId = file.attachment?.applianceId ?? target?.id;
    if (!applianceId) return;
    this.attaching.set(true);
    this.attachError.set(null);
    try {
      const result = await firstValueFrom(this.api.attach(file.id, applianceId));
      this.attachResult.set(result);
      this.file.set({ ...file, attachment: result.attachment });
    } catch (error) {
      this.attachError.set(errorMessage(error));
    } finally {
      this.attaching.set(false);
    }
  }

  protected async remove(file: LoggerFileView): Promise<void> {
    try {
      await firstValueFrom(this.api.remove(file.id));
      await this.router.navigate(['/logger-files']);
    } catch (error) {
      this.error.set(errorMessage(error));
      this.confirmingDelete.set(false);
    }
  }
}
