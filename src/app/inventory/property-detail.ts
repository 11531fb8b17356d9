import { AfterViewInit, ChangeDetectionStrategy, Component, inject, input, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { Subject, catchError, firstValueFrom, map, merge, of, skip, switchMap, type Observable } from 'rxjs';
import { UNIT_SORTS, type ApplianceView, type ArchiveFilter, type PropertyView, type UnitView } from '../../../shared/api/inventory';
import type { ApplianceStyle } from '../../../shared/domain';
import { EmptyState } from '../shared/empty-state/empty-state';
import { ApplianceActions } from './appliance-actions';
import { STYLE_LABELS, placeLabel } from './labels';
import { ListStatus } from './list-status';
import { errorMessage } from './messages';
import { ListFilterBar } from './list-filter-bar';
import { ListFilters, nothingYet } from './list-filters';
import { PagedTable } from './paged-table';
import { PropertyApi } from './property-api';
import { PropertyDialog } from './property-dialog';
import { UnitApi } from './unit-api';
import { UnitDialog, type UnitDialogData } from './unit-dialog';

/** One property: its address and time zone, its units (server-paged) with their appliances and sensors. */
@Component({
  selector: 'cw-property-detail',
  imports: [
    EmptyState,
    ListFilterBar,
    ListStatus,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSortModule,
    MatTableModule,
    RouterLink,
  ],
  providers: [ApplianceActions],
  templateUrl: './property-detail.html',
  styleUrls: ['./list.scss', './property-detail.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PropertyDetail implements AfterViewInit {
  private readonly properties = inject(PropertyApi);
  private readonly units = inject(UnitApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly appliances = inject(ApplianceActions);

  /** From the route (`properties/:propertyId`). */
  readonly propertyId = input.required<string>();
  readonly sort = viewChild.required(MatSort);
  readonly paginator = viewChild.required(MatPaginator);

  protected readonly styleLabel = (style: ApplianceStyle) => STYLE_LABELS[style];
  protected readonly property = signal<PropertyView | null>(null);
  protected readonly propertyError = signal<string | null>(null);
  protected readonly table = new PagedTable<UnitView>();
  protected readonly columns = ['label', 'appliances', 'actions'];
  protected readonly filters = new ListFilters({ q: '', status: 'active' as ArchiveFilter });
  protected readonly noUnits = nothingYet(this.table, this.filters);
  private readonly propertyChanges = toObservable(this.propertyId);

  private readonly propertyReloads = new Subject<void>();

  constructor() {
    merge(this.propertyChanges, this.propertyReloads)
      .pipe(
        switchMap(() =>
          this.properties.get(this.propertyId()).pipe(
            map((property) => ({ property, error: null as string | null })),
            catchError((error: unknown) => of({ property: null, error: errorMessage(error) })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ property, error }) => {
        this.property.set(property);
        this.propertyError.set(error);
      });
  }

  ngAfterViewInit(): void {
    this.filters.connect(this.table, {
      sort: this.sort(),
      paginator: this.paginator(),
      sortKeys: UNIT_SORTS,
      defaultSort: 'label',
      fetch: (query) => this.units.list(this.propertyId(), query),
      // Another property in the same component (a link from one property to the next) starts over too.
      restarts: this.propertyChanges.pipe(skip(1)),
    });
  }

  protected place(unit: UnitView): string {
    return placeLabel(this.property()?.name ?? '', unit.label);
  }

  protected editProperty(property: PropertyView): void {
    this.dialog
      .open<PropertyDialog, PropertyView, PropertyView>(PropertyDialog, { data: property, autoFocus: 'first-tabbable', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => saved && this.property.set(saved));
  }

  protected async archiveProperty(property: PropertyView): Promise<void> {
    const saved = await this.run(this.properties.archive(property.id));
    if (saved) this.snackBar.open(`${property.name} is archived with its units, appliances and sensors.`, 'OK', { duration: 6000 });
  }

  protected async restoreProperty(property: PropertyView): Promise<void> {
    if (await this.run(this.properties.restore(property.id))) this.snackBar.open(`${property.name} is back in the inventory.`, 'OK', { duration: 5000 });
  }

  protected addUnit(property: PropertyView): void {
    this.openUnitDialog({ propertyId: property.id, propertyName: property.name, unit: null });
  }

  protected editUnit(unit: UnitView): void {
    this.openUnitDialog({ propertyId: unit.propertyId, propertyName: this.property()?.name ?? '', unit });
  }

  protected async archiveUnit(unit: UnitView): Promise<void> {
    if (await this.runUnit(this.units.archive(unit.id))) this.snackBar.open(`Unit ${unit.label} is archived with its appliances.`, 'OK', { duration: 5000 });
  }

  protected async restoreUnit(unit: UnitView): Promise<void> {
    if (await this.runUnit(this.units.restore(unit.id))) this.snackBar.open(`Unit ${unit.label} is back.`, 'OK', { duration: 5000 });
  }

  protected async addAppliance(unit: UnitView): Promise<void> {
    if (await this.appliances.add(unit.id, this.place(unit))) this.refresh();
  }

  protected async editAppliance(appliance: ApplianceView): Promise<void> {
    if (await this.appliances.edit(appliance)) this.refresh();
  }

  protected async pairSensor(appliance: ApplianceView): Promise<void> {
    if (await this.appliances.pairSensor(appliance)) this.refresh();
  }

  protected archiveAppliance(appliance: ApplianceView): void {
    void this.appliances.archive(appliance, () => this.refresh());
  }

  protected async restoreAppliance(appliance: ApplianceView): Promise<void> {
    if (await this.appliances.restore(appliance)) this.refresh();
  }

  private openUnitDialog(data: UnitDialogData): void {
    this.dialog
      .open<UnitDialog, UnitDialogData, UnitView>(UnitDialog, { data, autoFocus: 'first-tabbable', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.snackBar.open(data.unit ? `Unit ${saved.label} is saved.` : `Unit ${saved.label} is added.`, 'OK', { duration: 4000 });
        this.refresh();
      });
  }

  /** The units and the property's counts. */
  private refresh(): void {
    this.table.reload();
    this.propertyReloads.next();
  }

  private async run(call: Observable<PropertyView>): Promise<PropertyView | null> {
    try {
      const saved = await firstValueFrom(call);
      this.property.set(saved);
      this.table.reload();
      return saved;
    } catch (error) {
      this.snackBar.open(errorMessage(error), 'OK', { duration: 8000 });
      return null;
    }
  }

  private async runUnit(call: Observable<UnitView>): Promise<boolean> {
    try {
      await firstValueFrom(call);
      this.refresh();
      return true;
    } catch (error) {
      this.snackBar.open(errorMessage(error), 'OK', { duration: 8000 });
      return false;
    }
  }
}

