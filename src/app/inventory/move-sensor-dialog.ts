import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';
import type { ApplianceView, SensorView } from '../../../shared/api/inventory';
import { AppliancePicker } from './appliance-picker';
import { STYLE_LABELS, placeLabel } from './labels';
import { errorMessage } from './messages';
import { SensorApi } from './sensor-api';

/** Moves a sensor to another appliance (one without a sensor); closes with the moved sensor. */
@Component({
  selector: 'cw-move-sensor-dialog',
  imports: [AppliancePicker, MatButtonModule, MatDialogModule],
  template: `
    <h2 mat-dialog-title>Move sensor {{ sensor.deviceId }}</h2>
    <mat-dialog-content>
      <p class="lead">Now in the {{ from }}. Its readings go to the new appliance from its next report on; the history stays where it was recorded.</p>
      @if (error(); as message) {
        <p class="message" role="alert">{{ message }}</p>
      }
      <cw-appliance-picker label="Move to appliance" [excludeId]="sensor.applianceId" [(selected)]="target" />
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="button" (click)="move()" [disabled]="!target() || busy()">Move sensor</button>
    </mat-dialog-actions>
  `,
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MoveSensorDialog {
  private readonly api = inject(SensorApi);
  private readonly dialog = inject<MatDialogRef<MoveSensorDialog, SensorView>>(MatDialogRef);
  protected readonly sensor = inject<SensorView>(MAT_DIALOG_DATA);

  protected readonly from = `${STYLE_LABELS[this.sensor.style].toLowerCase()} at ${placeLabel(this.sensor.propertyName, this.sensor.unitLabel)}`;
  protected readonly target = signal<ApplianceView | null>(null);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected async move(): Promise<void> {
    const target = this.target();
    if (!target) return;
    this.busy.set(true);
    this.error.set(null);
    try {
      this.dialog.close(await firstValueFrom(this.api.change(this.sensor.id, { applianceId: target.id })));
    } catch (error) {
      this.error.set(errorMessage(error));
    } finally {
      this.busy.set(false);
    }
  }
}
