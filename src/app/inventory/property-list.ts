import { BreakpointObserver } from '@angular/cdk/layout';
import { AfterViewInit, ChangeDetectionStrategy, Component, DestroyRef, computed, inject, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { debounceTime, firstValueFrom, map } from 'rxjs';
import { PROPERTY_SORTS, type ArchiveFilter, type PropertyQueryInput, type PropertyView } from '../../../shared/api/inventory';
import { EmptyState } from '../shared/empty-state/empty-state';
import { errorMessage } from './messages';
import { PagedTable, sortDirection, sortKey } from './paged-table';
import { PropertyApi } from './property-api';
import { PropertyDialog } from './property-dialog';

export const PROPERTY_PAGE_SIZE = 25;

/** The organization's properties, server-paged, with search, archive filter and row actions. */
@Component({
  selector: 'cw-property-list',
  imports: [
    EmptyState,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './property-list.html',
  styleUrls: ['./list.scss', './property-list.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PropertyList implements AfterViewInit {
  private readonly api = inject(PropertyApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);
  private readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 719px)').pipe(map((state) => state.matches)), { initialValue: false });

  readonly sort = viewChild.required(MatSort);
  readonly paginator = viewChild.required(MatPaginator);

  protected readonly table = new PagedTable<PropertyView>();
  protected readonly pageSize = PROPERTY_PAGE_SIZE;
  protected readonly filters = new FormGroup({
    q: new FormControl('', { nonNullable: true }),
    status: new FormControl<ArchiveFilter>('active', { nonNullable: true }),
  });
  private readonly filterValues = toSignal(this.filters.valueChanges, { initialValue: this.filters.getRawValue() });
  protected readonly columns = computed(() => (this.narrow() ? ['name', 'counts', 'actions'] : ['name', 'city', 'timeZone', 'counts', 'actions']));
  /** Nothing at all yet (not merely nothing matching a search): say how to begin. */
  protected readonly nothingYet = computed(() => this.table.loaded() && this.table.total() === 0 && !this.filterValues().q && this.filterValues().status === 'active');

  ngAfterViewInit(): void {
    this.table.connect({
      sort: this.sort(),
      paginator: this.paginator(),
      filters: this.filters.valueChanges.pipe(debounceTime(300)),
      query: (sort, paginator): PropertyQueryInput => ({
        q: this.filters.controls.q.value.trim() || undefined,
        status: this.filters.controls.status.value,
        sort: sortKey(sort, PROPERTY_SORTS, 'name'),
        direction: sortDirection(sort),
        page: paginator.pageIndex,
        pageSize: paginator.pageSize,
      }),
      fetch: (query) => this.api.list(query),
      destroyRef: this.destroyRef,
    });
  }

  protected add(): void {
    this.openDialog(null);
  }

  protected edit(property: PropertyView): void {
    this.openDialog(property);
  }

  protected async archive(property: PropertyView): Promise<void> {
    if (!(await this.act(() => this.api.archive(property.id)))) return;
    const undo = this.snackBar.open(`${property.name} is archived with its units, appliances and sensors.`, 'Undo', { duration: 8000 });
    undo.onAction().subscribe(() => void this.restore(property));
  }

  protected async restore(property: PropertyView): Promise<void> {
    if (await this.act(() => this.api.restore(property.id))) this.snackBar.open(`${property.name} is back in the inventory.`, 'OK', { duration: 5000 });
  }

  private openDialog(property: PropertyView | null): void {
    this.dialog
      .open<PropertyDialog, PropertyView | null, PropertyView>(PropertyDialog, { data: property, autoFocus: 'first-tabbable', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.snackBar.open(property ? `${saved.name} is saved.` : `${saved.name} is added. Open it to add units.`, 'OK', { duration: 5000 });
        this.table.reload();
      });
  }

  private async act(call: () => ReturnType<PropertyApi['archive']>): Promise<boolean> {
    try {
      await firstValueFrom(call());
      this.table.reload();
      return true;
    } catch (error) {
      this.snackBar.open(errorMessage(error), 'OK', { duration: 8000 });
      return false;
    }
  }
}
