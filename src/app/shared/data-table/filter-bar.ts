import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Subject, debounceTime } from 'rxjs';
import type { FilterField, TableState } from './table-types';

/** What the filter bar needs of a table (a ServerTable of any row type). */
export interface FilterTarget {
  state(): TableState;
  filtered(): boolean;
  setFilter(key: string, value: string, replaceUrl?: boolean): void;
  clearFilters(): void;
}

/** Typing waits this long before the table asks the server again. */
export const SEARCH_DEBOUNCE_MS = 300;

/** The filters of a server table, written to and read from the page's URL through it. */
@Component({
  selector: 'cw-filter-bar',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './filter-bar.html',
  styleUrl: './filter-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FilterBar {
  readonly table = input.required<FilterTarget>();
  readonly fields = input.required<readonly FilterField[]>();
  /** Partial: a filter nobody has set has no key, and the template shows it empty. */
  protected readonly values = computed<Readonly<Partial<Record<string, string>>>>(() => this.table().state().filters);
  private readonly typing = new Subject<{ key: string; value: string }>();

  constructor() {
    this.typing.pipe(debounceTime(SEARCH_DEBOUNCE_MS), takeUntilDestroyed(inject(DestroyRef))).subscribe(({ key, value }) => this.table().setFilter(key, value, true));
  }

  protected typed(key: string, event: Event): void {
    this.typing.next({ key, value: (event.target as HTMLInputElement).value });
  }

  protected chosen(key: string, value: string): void {
    this.table().setFilter(key, value ?? '');
  }

  protected dated(key: string, event: Event): void {
    this.table().setFilter(key, (event.target as HTMLInputElement).value);
  }
}
