import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { SensorCredentials } from '../../../shared/api/inventory';
import { SensorCredentialsPanel } from './sensor-credentials-panel';

/** Shows a sensor's new one-time secret (after "new secret"). */
@Component({
  selector: 'cw-sensor-credentials-dialog',
  imports: [MatButtonModule, MatDialogModule, SensorCredentialsPanel],
  template: `
    <h2 mat-dialog-title>New secret for {{ credentials.deviceId }}</h2>
    <mat-dialog-content>
      <p class="lead">The old secret no longer works: the sensor is refused at its next connection until it has this one.</p>
      <cw-sensor-credentials-panel [credentials]="credentials" />
    </mat-dialog-content>
    <mat-dialog-actions align="end"><button mat-flat-button type="button" mat-dialog-close>I have entered the secret</button></mat-dialog-actions>
  `,
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SensorCredentialsDialog {
  protected readonly credentials = inject<SensorCredentials>(MAT_DIALOG_DATA);
}
