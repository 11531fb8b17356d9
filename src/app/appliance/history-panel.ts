import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, map, of, switchMap, tap } from 'rxjs';
import type { ApplianceDetail } from '../../../shared/api/appliances';
import type { ApplianceHistory } from '../../../shared/api/telemetry';
import type { TemperatureUnit } from '../../../shared/temperature';
import { formatZoned, startOfDayInZone } from '../fleet/zoned-date';
import { ReadingChart } from '../shared/reading-chart/reading-chart';
import { ApplianceApi, type HistoryRange } from './appliance-api';
import { chartDataOf, hasReadings } from './history-chart';
import { DEFAULT_CHOICE, RANGE_PRESETS, maxPointsFor, rangeOf, resolutionWords, type PresetKey, type RangeChoice } from './history-range';

/** A zoom narrower than this is not worth a reload. */
const MIN_ZOOM_MS = 15 * 60_000;
const DAY_MS = 86_400_000;

interface Request {
  id: string;
  choice: RangeChoice;
  tick: number;
}

/** The temperature chart with its range presets; each range loads the resolution the history API picks for it. */
@Component({
  selector: 'cw-history-panel',
  imports: [MatButtonModule, MatButtonToggleModule, MatCardModule, MatDatepickerModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, ReactiveFormsModule, ReadingChart],
  providers: [provideNativeDateAdapter()],
  templateUrl: './history-panel.html',
  styleUrl: './history-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HistoryPanel {
  private readonly api = inject(ApplianceApi);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  readonly detail = input.required<ApplianceDetail>();
  readonly unit = input<TemperatureUnit>('F');
  /** Bumped by the page when live readings arrived: a range that ends now reloads. */
  readonly refresh = input(0);

  protected readonly presets = RANGE_PRESETS;
  protected readonly choice = signal<RangeChoice>(DEFAULT_CHOICE);
  protected readonly previous = signal<RangeChoice | null>(null);
  protected readonly customOpen = signal(false);
  protected readonly history = signal<ApplianceHistory | null>(null);
  protected readonly range = signal<HistoryRange | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly customForm = new FormGroup({ start: new FormControl<Date | null>(null), end: new FormControl<Date | null>(null) });

  protected readonly toggleValue = computed(() => {
    const choice = this.choice();
    return choice.kind === 'preset' ? choice.key : 'custom';
  });
  protected readonly timeZone = computed(() => this.detail().place.timeZone);
  protected readonly chartData = computed(() => {
    const history = this.history();
    const range = this.range();
    return history && range ? chartDataOf(history, this.detail(), range) : null;
  });
  protected readonly empty = computed(() => {
    const history = this.history();
    return !!history && !hasReadings(history);
  });
  protected readonly caption = computed(() => {
    const history = this.history();
    const range = this.range();
    if (!history || !range) return '';
    const zone = this.timeZone();
    return `${formatZoned(range.fromMs, zone, 'short')} – ${formatZoned(range.toMs, zone, 'date-time')} · ${resolutionWords(history)}`;
  });

  private readonly request = signal<Request | null>(null);

  constructor() {
    effect(() => {
      const id = this.detail().id;
      const choice = this.choice();
      const tick = this.refresh();
      untracked(() => {
        const current = this.request();
        // Nothing new; and a live refresh only matters to a range that ends now.
        if (current && current.id === id && current.choice === choice && (current.tick === tick || choice.kind === 'custom')) return;
        this.request.set({ id, choice, tick });
      });
    });
    toObservable(this.request)
      .pipe(
        switchMap((request) => {
          if (!request) return of(null);
          const range = rangeOf(request.choice, Date.now());
          this.loading.set(true);
          return this.api.history(request.id, range, maxPointsFor(this.host.nativeElement.clientWidth || 800)).pipe(
            map((history) => ({ history, range, error: null as string | null })),
            catchError((error: Error) => of({ history: null, range, error: error.message })),
          );
        }),
        tap(() => this.loading.set(false)),
        takeUntilDestroyed(),
      )
      .subscribe((result) => {
        if (!result) return;
        this.error.set(result.error);
        if (result.history) {
          this.history.set(result.history);
          this.range.set(result.range);
        }
      });
  }

  protected onToggle(value: PresetKey | 'custom'): void {
    if (value === 'custom') {
      this.customOpen.set(true);
      return;
    }
    this.customOpen.set(false);
    this.previous.set(null);
    this.choice.set({ kind: 'preset', key: value });
  }

  /** The picked days, whole, in the property's time zone. */
  protected applyCustom(): void {
    const { start, end } = this.customForm.getRawValue();
    if (!start || !end) return;
    const zone = this.timeZone();
    const fromMs = startOfDayInZone(start.getFullYear(), start.getMonth(), start.getDate(), zone);
    const toMs = Math.min(Date.now(), startOfDayInZone(end.getFullYear(), end.getMonth(), end.getDate(), zone) + DAY_MS);
    if (toMs <= fromMs) return;
    this.previous.set(null);
    this.choice.set({ kind: 'custom', fromMs, toMs });
  }

  /** Zooming loads the window at the finer resolution it deserves; "back" returns to the range before. */
  protected onZoomed(window: { fromMs: number; toMs: number }): void {
    if (window.toMs - window.fromMs < MIN_ZOOM_MS) return;
    if (!this.previous()) this.previous.set(this.choice());
    this.choice.set({ kind: 'custom', fromMs: Math.round(window.fromMs), toMs: Math.round(window.toMs) });
  }

  protected back(): void {
    const previous = this.previous();
    if (!previous) return;
    this.previous.set(null);
    this.choice.set(previous);
  }

  protected retry(): void {
    const current = this.request();
    if (current) this.request.set({ ...current });
  }
}
