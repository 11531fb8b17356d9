import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSnackBar } from '@angular/material/snack-bar';
import { NgTemplateOutlet } from '@angular/common';
import { RouterLink } from '@angular/router';
import { Subject, catchError, debounceTime, firstValueFrom, forkJoin, map, merge, of, startWith, switchMap, tap } from 'rxjs';
import type { Page, PropertyView } from '../../../shared/api/inventory';
import type { ContractorView } from '../../../shared/api/work-orders';
import type { ApplianceStyle } from '../../../shared/domain';
import { EmptyState } from '../shared/empty-state/empty-state';
import { ContractorApi } from './contractor-api';
import { CoverageCell, type ContractorOption, type SlotPick } from './coverage-cell';
import { CoverageGrid, STYLE_COLUMNS, slotKey } from './coverage-grid';
import { ListStatus } from './list-status';
import { errorMessage } from './messages';
import { PropertyApi } from './property-api';

export const COVERAGE_PAGE_SIZE = 25;

/**
 * The coverage table as a grid of property × appliance style: in each cell the contractor
 * dispatched first and the backup, each saved on its own as soon as it is picked.
 */
@Component({
  selector: 'cw-coverage-editor',
  imports: [CoverageCell, EmptyState, ListStatus, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatPaginatorModule, NgTemplateOutlet, ReactiveFormsModule, RouterLink],
  templateUrl: './coverage-editor.html',
  styleUrls: ['./list.scss', './coverage-editor.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoverageEditor {
  private readonly api = inject(ContractorApi);
  private readonly properties = inject(PropertyApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly pages = new Subject<PageEvent>();

  protected readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 719px)').pipe(map((state) => state.matches)), { initialValue: false });
  protected readonly columns = STYLE_COLUMNS;
  protected readonly pageSize = COVERAGE_PAGE_SIZE;
  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly propertyPage = signal<Page<PropertyView> | null>(null);
  protected readonly contractors = signal<ContractorView[] | null>(null);
  protected readonly grid = signal(new CoverageGrid([]));
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly saving = signal<ReadonlySet<string>>(new Set());
  protected readonly cellErrors = signal<Readonly<Partial<Record<string, string>>>>({});
  protected readonly options = computed<ContractorOption[]>(() => (this.contractors() ?? []).map((c) => ({ id: c.id, name: c.name, archived: c.archivedAt !== null })));
  protected readonly noContractor = computed(() => this.contractors()?.every((c) => c.archivedAt !== null) ?? false);
  protected readonly slotKey = slotKey;

  constructor() {
    forkJoin([this.api.list(), this.api.coverage()])
      .pipe(takeUntilDestroyed())
      .subscribe({
        next: ([contractors, rows]) => {
          this.contractors.set(contractors);
          this.grid.set(new CoverageGrid(rows));
        },
        error: (error: unknown) => this.error.set(errorMessage(error)),
      });
    const searches = this.search.valueChanges.pipe(debounceTime(300), map(() => 0));
    merge(searches, this.pages.pipe(map((event) => event.pageIndex)))
      .pipe(
        startWith(0),
        tap(() => this.loading.set(true)),
        switchMap((page) =>
          this.properties.list({ status: 'active', q: this.search.value.trim() || undefined, sort: 'name', direction: 'asc', page, pageSize: COVERAGE_PAGE_SIZE }).pipe(catchError((error: unknown) => of(errorMessage(error)))),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((answer) => {
        this.loading.set(false);
        if (typeof answer === 'string') return this.error.set(answer);
        this.propertyPage.set(answer);
      });
  }

  protected turnPage(event: PageEvent): void {
    this.pages.next(event);
  }

  protected place(property: PropertyView, label: string): string {
    return `${property.name}, ${label.toLowerCase()}`;
  }

  protected async save(property: PropertyView, style: ApplianceStyle | null, pick: SlotPick): Promise<void> {
    const key = slotKey(property.id, style);
    const before = this.grid().contractorId(property.id, style, pick.rank);
    this.mark(key, true);
    this.setCellError(key, null);
    try {
      const rows = await firstValueFrom(this.api.setCoverage({ propertyId: property.id, applianceStyle: style, rank: pick.rank, contractorId: pick.contractorId }));
      this.grid.update((grid) => grid.withProperty(property.id, rows));
    } catch (error) {
      pick.select.value = before; // the select shows what is saved, not the refused choice
      const message = errorMessage(error);
      this.setCellError(key, message);
      this.snackBar.open(`Not saved: ${message}`, 'OK', { duration: 8000 });
    } finally {
      this.mark(key, false);
    }
  }

  private mark(key: string, busy: boolean): void {
    this.saving.update((keys) => {
      const next = new Set(keys);
      if (busy) next.add(key);
      else next.delete(key);
      return next;
    });
  }

  private setCellError(key: string, message: string | null): void {
    this.cellErrors.update((errors) => {
      const { [key]: _dropped, ...rest } = errors;
      return message ? { ...rest, [key]: message } : rest;
    });
  }
}
