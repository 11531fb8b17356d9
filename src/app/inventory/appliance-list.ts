import { BreakpointObserver } from '@angular/cdk/layout';
import { AfterViewInit, ChangeDetectionStrategy, Component, computed, inject, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, map, of } from 'rxjs';
import { APPLIANCE_SORTS, type ApplianceView, type ArchiveFilter, type PropertyView } from '../../../shared/api/inventory';
import type { ApplianceStyle } from '../../../shared/domain';
import { EmptyState } from '../shared/empty-state/empty-state';
import { ApplianceActions } from './appliance-actions';
import { ApplianceInventoryApi } from './appliance-inventory-api';
import { STYLE_CHOICES, STYLE_LABELS } from './labels';
import { ListFilterBar } from './list-filter-bar';
import { ListFilters, nothingYet } from './list-filters';
import { ListStatus } from './list-status';
import { PagedTable } from './paged-table';
import { PropertyApi } from './property-api';

/** Every appliance of the organization across properties, with its sensor; server-paged. */
@Component({
  selector: 'cw-appliance-list',
  imports: [
    EmptyState,
    ListFilterBar,
    ListStatus,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatMenuModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    ReactiveFormsModule,
    RouterLink,
  ],
  providers: [ApplianceActions],
  templateUrl: './appliance-list.html',
  styleUrl: './list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApplianceList implements AfterViewInit {
  private readonly api = inject(ApplianceInventoryApi);
  private readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 719px)').pipe(map((state) => state.matches)), { initialValue: false });
  protected readonly actions = inject(ApplianceActions);

  readonly sort = viewChild.required(MatSort);
  readonly paginator = viewChild.required(MatPaginator);

  protected readonly styleLabel = (style: ApplianceStyle) => STYLE_LABELS[style];
  protected readonly styles = STYLE_CHOICES;
  protected readonly table = new PagedTable<ApplianceView>();
  protected readonly properties = toSignal(
    inject(PropertyApi)
      .list({ pageSize: 200, sort: 'name' })
      .pipe(
        map((page) => page.items),
        catchError(() => of([] as PropertyView[])),
      ),
    { initialValue: [] as PropertyView[] },
  );
  protected readonly filters = new ListFilters({ q: '', propertyId: '', style: '' as ApplianceStyle | '', status: 'active' as ArchiveFilter });
  protected readonly columns = computed(() => (this.narrow() ? ['place', 'style', 'actions'] : ['place', 'style', 'model', 'installedOn', 'sensor', 'actions']));
  protected readonly nothingYet = nothingYet(this.table, this.filters);

  ngAfterViewInit(): void {
    this.filters.connect(this.table, {
      sort: this.sort(),
      paginator: this.paginator(),
      sortKeys: APPLIANCE_SORTS,
      defaultSort: 'property',
      fetch: (query) => {
        const { propertyId, style } = this.filters.raw();
        return this.api.list({ ...query, propertyId: propertyId || undefined, style: style || undefined });
      },
    });
  }

  protected async edit(appliance: ApplianceView): Promise<void> {
    if (await this.actions.edit(appliance)) this.table.reload();
  }

  protected async pairSensor(appliance: ApplianceView): Promise<void> {
    if (await this.actions.pairSensor(appliance)) this.table.reload();
  }

  protected archive(appliance: ApplianceView): void {
    void this.actions.archive(appliance, () => this.table.reload());
  }

  protected async restore(appliance: ApplianceView): Promise<void> {
    if (await this.actions.restore(appliance)) this.table.reload();
  }
}
