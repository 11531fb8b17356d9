import { BreakpointObserver } from '@angular/cdk/layout';
import { DatePipe } from '@angular/common';
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
import { firstValueFrom, map, type Observable } from 'rxjs';
import { SENSOR_SORTS, type ArchiveFilter, type SensorCredentials, type SensorView } from '../../../shared/api/inventory';
import type { ApplianceStyle } from '../../../shared/domain';
import { EmptyState } from '../shared/empty-state/empty-state';
import { STYLE_LABELS, intervalLabel } from './labels';
import { ListStatus } from './list-status';
import { errorMessage } from './messages';
import { MoveSensorDialog } from './move-sensor-dialog';
import { ListFilterBar } from './list-filter-bar';
import { ListFilters, nothingYet } from './list-filters';
import { PagedTable } from './paged-table';
import { SensorApi } from './sensor-api';
import { SensorCredentialsDialog } from './sensor-credentials-dialog';

/** The organization's sensors with where they sit; new secret, move, retire and restore. */
@Component({
  selector: 'cw-sensor-list',
  imports: [
    DatePipe,
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
  templateUrl: './sensor-list.html',
  styleUrl: './list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SensorList implements AfterViewInit {
  private readonly api = inject(SensorApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 719px)').pipe(map((state) => state.matches)), { initialValue: false });

  readonly sort = viewChild.required(MatSort);
  readonly paginator = viewChild.required(MatPaginator);

  protected readonly styleLabel = (style: ApplianceStyle) => STYLE_LABELS[style];
  protected readonly intervalLabel = intervalLabel;
  protected readonly table = new PagedTable<SensorView>();
  protected readonly filters = new ListFilters({ q: '', status: 'active' as ArchiveFilter });
  protected readonly columns = computed(() => (this.narrow() ? ['deviceId', 'place', 'actions'] : ['deviceId', 'place', 'interval', 'lastSeenAt', 'actions']));
  protected readonly nothingYet = nothingYet(this.table, this.filters);

  ngAfterViewInit(): void {
    this.filters.connect(this.table, { sort: this.sort(), paginator: this.paginator(), sortKeys: SENSOR_SORTS, defaultSort: 'deviceId', fetch: (query) => this.api.list(query) });
  }

  protected async newSecret(sensor: SensorView): Promise<void> {
    const credentials = await this.run(this.api.newSecret(sensor.id));
    if (credentials) this.dialog.open<SensorCredentialsDialog, SensorCredentials>(SensorCredentialsDialog, { data: credentials, disableClose: true, maxWidth: '95vw' });
  }

  protected move(sensor: SensorView): void {
    this.dialog
      .open<MoveSensorDialog, SensorView, SensorView>(MoveSensorDialog, { data: sensor, autoFocus: 'first-tabbable', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((moved) => {
        if (!moved) return;
        this.snackBar.open(`Sensor ${moved.deviceId} now reports for ${moved.propertyName} · ${moved.unitLabel}.`, 'OK', { duration: 5000 });
        this.table.reload();
      });
  }

  protected async archive(sensor: SensorView): Promise<void> {
    if (!(await this.run(this.api.archive(sensor.id)))) return;
    const undo = this.snackBar.open(`Sensor ${sensor.deviceId} is retired: the broker refuses it from its next connection.`, 'Undo', { duration: 8000 });
    undo.onAction().subscribe(() => void this.restore(sensor));
  }

  protected async restore(sensor: SensorView): Promise<void> {
    if (await this.run(this.api.restore(sensor.id))) this.snackBar.open(`Sensor ${sensor.deviceId} is accepted again.`, 'OK', { duration: 5000 });
  }

  private async run<T>(call: Observable<T>): Promise<T | null> {
    try {
      const result = await firstValueFrom(call);
      this.table.reload();
      return result;
    } catch (error) {
      this.snackBar.open(errorMessage(error), 'OK', { duration: 8000 });
      return null;
    }
  }
}
