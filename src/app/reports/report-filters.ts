import { ChangeDetectionStrategy, Component, effect, input, output } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { ReportRange } from '../../../shared/api/reports';
import { dateOfIso, isoDateOf } from './report-filters-url';
import type { ReportFilters } from './reports-api';

export interface PropertyOption {
  id: string;
  name: string;
}

/** The report's date range (Material range picker) and property; emits a change once a range is complete. */
@Component({
  selector: 'cw-report-filters',
  imports: [MatButtonModule, MatDatepickerModule, MatFormFieldModule, MatSelectModule, ReactiveFormsModule],
  providers: [provideNativeDateAdapter()],
  templateUrl: './report-filters.html',
  styleUrl: './report-filters.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportFilterBar {
  readonly filters = input.required<ReportFilters>();
  /** The range the server used (its default when the filters have none). */
  readonly range = input<ReportRange | null>(null);
  readonly properties = input<readonly PropertyOption[]>([]);
  readonly filtersChange = output<ReportFilters>();

  protected readonly form = new FormGroup({
    start: new FormControl<Date | null>(null),
    end: new FormControl<Date | null>(null),
    propertyId: new FormControl<string>('', { nonNullable: true }),
  });

  constructor() {
    effect(() => {
      const filters = this.filters();
      const from = filters.from ?? this.range()?.from ?? null;
      const to = filters.to ?? this.range()?.to ?? null;
      this.form.setValue({ start: from ? dateOfIso(from) : null, end: to ? dateOfIso(to) : null, propertyId: filters.propertyId ?? '' }, { emitEvent: false });
    });
  }

  /** The picker closes with both ends chosen; a half-chosen range waits. */
  protected rangeChosen(): void {
    const { start, end } = this.form.getRawValue();
    if (!start || !end || start > end) return;
    this.filtersChange.emit({ ...this.filters(), from: isoDateOf(start), to: isoDateOf(end) });
  }

  protected propertyChosen(propertyId: string): void {
    this.filtersChange.emit({ ...this.filters(), propertyId: propertyId || null });
  }

  protected lastTwelveMonths(): void {
    this.filtersChange.emit({ ...this.filters(), from: null, to: null });
  }
}
