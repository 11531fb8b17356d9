import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule, type MatChipListboxChange } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule, type MatSelectChange } from '@angular/material/select';
import { Subject, debounceTime, distinctUntilChanged } from 'rxjs';
import type { FleetFilters, FleetOverview } from '../../../shared/api/fleet';
import { AGE_BANDS, AGE_BAND_LABELS, type AgeBand, type HealthCounts } from '../../../shared/api/fleet-constants';
import { APPLIANCE_STYLES, HEALTH_STATES, type ApplianceStyle, type Health } from '../../../shared/domain';
import { HEALTH_ICONS, HEALTH_LABELS, STYLE_LABELS, healthColor } from './appliance-words';

export const SEARCH_DEBOUNCE_MS = 300;

/** The fleet's filters: health words with their counts, property, style, age, and search. */
@Component({
  selector: 'cw-fleet-filters',
  imports: [MatButtonModule, MatChipsModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './fleet-filters.html',
  styleUrl: './fleet-filters.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FleetFilterBar {
  readonly filters = input.required<FleetFilters>();
  readonly counts = input<HealthCounts | null>(null);
  readonly propertyOptions = input<FleetOverview['propertyOptions']>([]);
  readonly filtersChange = output<FleetFilters>();

  protected readonly healthStates = HEALTH_STATES;
  protected readonly styles = APPLIANCE_STYLES;
  protected readonly ageBands = AGE_BANDS;
  protected readonly healthLabels = HEALTH_LABELS;
  protected readonly healthIcons = HEALTH_ICONS;
  protected readonly styleLabels = STYLE_LABELS;
  protected readonly ageLabels = AGE_BAND_LABELS;
  protected readonly healthColor = healthColor;
  protected readonly active = computed(() => {
    const f = this.filters();
    return !!(f.property?.length || f.health?.length || f.style?.length || f.age || f.q);
  });

  private readonly search = new Subject<string>();

  constructor() {
    this.search.pipe(debounceTime(SEARCH_DEBOUNCE_MS), distinctUntilChanged(), takeUntilDestroyed()).subscribe((q) => this.change({ q: q || undefined }));
  }

  protected countOf(health: Health): string {
    const counts = this.counts();
    return counts ? counts[health].toLocaleString('en-US') : '…';
  }

  protected onHealth(event: MatChipListboxChange): void {
    const chosen = (event.value as Health[] | null) ?? [];
    this.change({ health: chosen.length ? chosen : undefined });
  }

  protected onProperty(event: MatSelectChange): void {
    const chosen = event.value as string[];
    this.change({ property: chosen.length ? chosen : undefined });
  }

  protected onStyle(event: MatSelectChange): void {
    const chosen = event.value as ApplianceStyle[];
    this.change({ style: chosen.length ? chosen : undefined });
  }

  protected onAge(event: MatSelectChange): void {
    this.change({ age: (event.value as AgeBand | '') || undefined });
  }

  protected onSearchInput(value: string): void {
    this.search.next(value.trim());
  }

  protected clear(): void {
    this.filtersChange.emit({});
  }

  private change(changes: Partial<FleetFilters>): void {
    this.filtersChange.emit({ ...this.filters(), ...changes });
  }
}
