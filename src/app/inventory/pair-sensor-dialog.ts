import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import { SENSOR_INTERVAL_DEFAULT_SECONDS, type ApplianceView, type SensorCredentials } from '../../../shared/api/inventory';
import { DEVICE_ID_PATTERN } from '../../../shared/telemetry';
import { ApplianceInventoryApi } from './appliance-inventory-api';
import { STYLE_LABELS, placeLabel } from './labels';
import { DialogSubmit } from './dialog-submit';
import { errorMessage, fieldErrors } from './messages';
import { SensorCredentialsPanel } from './sensor-credentials-panel';

export const INTERVAL_CHOICES = [
  { seconds: 60, label: 'Every minute' },
  { seconds: 120, label: 'Every 2 minutes' },
  { seconds: 300, label: 'Every 5 minutes' },
  { seconds: 600, label: 'Every 10 minutes' },
  { seconds: 900, label: 'Every 15 minutes' },
];

/** Pairs a sensor to an appliance, then shows its device id and one-time secret; closes with them. */
@Component({
  selector: 'cw-pair-sensor-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule, SensorCredentialsPanel],
  templateUrl: './pair-sensor-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PairSensorDialog {
  private readonly api = inject(ApplianceInventoryApi);
  private readonly dialog = inject<MatDialogRef<PairSensorDialog, SensorCredentials>>(MatDialogRef);
  protected readonly appliance = inject<ApplianceView>(MAT_DIALOG_DATA);

  protected readonly place = placeLabel(this.appliance.propertyName, this.appliance.unitLabel);
  protected readonly style = STYLE_LABELS[this.appliance.style];
  protected readonly intervals = INTERVAL_CHOICES;
  private readonly submitting = new DialogSubmit();
  protected readonly busy = this.submitting.busy;
  protected readonly error = this.submitting.error;
  protected readonly credentials = signal<SensorCredentials | null>(null);
  protected readonly form = new FormGroup({
    deviceId: new FormControl('', { nonNullable: true, validators: [Validators.pattern(DEVICE_ID_PATTERN)] }),
    intervalSeconds: new FormControl(SENSOR_INTERVAL_DEFAULT_SECONDS, { nonNullable: true }),
    replace: new FormControl(false, { nonNullable: true, validators: this.appliance.sensor ? [Validators.requiredTrue] : [] }),
  });

  protected submit(): Promise<void> {
    return this.submitting.run(
      this.form,
      async () => {
        const { deviceId, intervalSeconds, replace } = this.form.getRawValue();
        const credentials = await firstValueFrom(this.api.pairSensor(this.appliance.id, { deviceId: deviceId.trim() || undefined, intervalSeconds, replace }));
        this.credentials.set(credentials);
        this.dialog.disableClose = true; // the secret must not vanish with a stray click outside
      },
      (error) => fieldErrors(error)['deviceId'] ?? errorMessage(error),
    );
  }

  protected done(): void {
    this.dialog.close(this.credentials() ?? undefined);
  }
}
