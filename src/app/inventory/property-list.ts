import { BreakpointObserver } from '@angular/cdk/layout';
import { AfterViewInit, ChangeDetectionStrategy, Component, computed, inject, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { firstValueFrom, map } from 'rxjs';
import { PROPERTY_SORTS, type ArchiveFilter, type PropertyView } from '../../../shared/api/inventory';
import { EmptyState } from '../shared/empty-state/empty-state';
import { ListStatus } from './list-status';
import { errorMessage } from './messages';
import { ListFilterBar } from './list-filter-bar';
import { ListFilters, nothingYet } from './list-filters';
import { PagedTable } from './paged-table';
import { PropertyApi } from './property-api';
import { PropertyDialog } from './property-dialog';

export const PROPERTY_PAGE_SIZE = 25;

/** The organization's properties, server-paged, with search, archive filter and row actions. */
@Component({
  selector: 'cw-property-list',
  imports: [
    EmptyState,
    ListFilterBar,
    ListStatus,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatPaginatorModule,
    MatSortModule,
    MatTableModule,
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
  private readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 719px)').pipe(map((state) => state.matches)), { initialValue: false });

  readonly sort = viewChild.required(MatSort);
  readonly paginator = viewChild.required(MatPaginator);

  protected readonly table = new PagedTable<PropertyView>();
  protected readonly pageSize = PROPERTY_PAGE_SIZE;
  protected readonly filters = new ListFilters({ q: '', status: 'active' as ArchiveFilter });
  protected readonly columns = computed(() => (this.narrow() ? ['name', 'counts', 'actions'] : ['name', 'city', 'timeZone', 'counts', 'actions']));
  protected readonly nothingYet = nothingYet(this.table, this.filters);

  ngAfterViewInit(): void {
    this.filters.connect(this.table, { sort: this.sort(), paginator: this.paginator(), sortKeys: PROPERTY_SORTS, defaultSort: 'name', fetch: (query) => this.api.list(query) });
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
