import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom, type Observable } from 'rxjs';
import type { ApplianceView, SensorCredentials } from '../../../shared/api/inventory';
import { ApplianceDialog, type ApplianceDialogData } from './appliance-dialog';
import { ApplianceInventoryApi } from './appliance-inventory-api';
import { STYLE_LABELS, placeLabel } from './labels';
import { errorMessage } from './messages';
import { PairSensorDialog } from './pair-sensor-dialog';

/**
 * What a manager does to an appliance from any list: edit, pair a sensor, archive, restore.
 * Each resolves true when something changed, so the list reloads.
 */
@Injectable()
export class ApplianceActions {
  private readonly api = inject(ApplianceInventoryApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  async add(unitId: string, place: string): Promise<boolean> {
    return this.openEditor({ unitId, place, appliance: null });
  }

  async edit(appliance: ApplianceView): Promise<boolean> {
    return this.openEditor({ unitId: appliance.unitId, place: placeLabel(appliance.propertyName, appliance.unitLabel), appliance });
  }

  async pairSensor(appliance: ApplianceView): Promise<boolean> {
    const paired = await firstValueFrom(
      this.dialog.open<PairSensorDialog, ApplianceView, SensorCredentials>(PairSensorDialog, { data: appliance, autoFocus: 'first-tabbable', maxWidth: '95vw' }).afterClosed(),
    );
    if (paired) this.snackBar.open(`Sensor ${paired.deviceId} is paired.`, 'OK', { duration: 5000 });
    return !!paired;
  }

  async archive(appliance: ApplianceView, reload: () => void): Promise<void> {
    if (!(await this.run(this.api.archive(appliance.id)))) return;
    reload();
    const sensorNote = appliance.sensor ? ' Its sensor is retired with it.' : '';
    const undo = this.snackBar.open(`${STYLE_LABELS[appliance.style]} at ${placeLabel(appliance.propertyName, appliance.unitLabel)} is archived.${sensorNote}`, 'Undo', { duration: 8000 });
    undo.onAction().subscribe(() => void this.restore(appliance).then((done) => done && reload()));
  }

  async restore(appliance: ApplianceView): Promise<boolean> {
    const done = await this.run(this.api.restore(appliance.id));
    if (done) this.snackBar.open('The appliance is back in the inventory.', 'OK', { duration: 5000 });
    return done;
  }

  private async openEditor(data: ApplianceDialogData): Promise<boolean> {
    const saved = await firstValueFrom(this.dialog.open<ApplianceDialog, ApplianceDialogData, ApplianceView>(ApplianceDialog, { data, autoFocus: 'first-tabbable', maxWidth: '95vw' }).afterClosed());
    if (saved) this.snackBar.open(`${STYLE_LABELS[saved.style]} at ${placeLabel(saved.propertyName, saved.unitLabel)} is saved.`, 'OK', { duration: 5000 });
    return !!saved;
  }

  private async run(call: Observable<unknown>): Promise<boolean> {
    try {
      await firstValueFrom(call);
      return true;
    } catch (error) {
      this.snackBar.open(errorMessage(error), 'OK', { duration: 8000 });
      return false;
    }
  }
}
