import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import { warrantyBeforeInstall, type ApplianceView } from '../../../shared/api/inventory';
import type { ApplianceStyle } from '../../../shared/domain';
import { ApplianceInventoryApi } from './appliance-inventory-api';
import { STYLE_CHOICES } from './labels';
import { DialogSubmit } from './dialog-submit';
import { errorMessage, fieldErrors } from './messages';

export interface ApplianceDialogData {
  unitId: string;
  /** "Cedar Row · 4B", for the title. */
  place: string;
  appliance: ApplianceView | null;
}

function datesInOrder(group: AbstractControl): ValidationErrors | null {
  const { installedOn, warrantyEndsOn } = group.value as { installedOn: string; warrantyEndsOn: string };
  return warrantyBeforeInstall(installedOn || null, warrantyEndsOn || null) ? { datesOutOfOrder: true } : null;
}

/** Adds an appliance to a unit or edits one; closes with the saved appliance. */
@Component({
  selector: 'cw-appliance-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './appliance-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApplianceDialog {
  private readonly api = inject(ApplianceInventoryApi);
  private readonly dialog = inject<MatDialogRef<ApplianceDialog, ApplianceView>>(MatDialogRef);
  protected readonly data = inject<ApplianceDialogData>(MAT_DIALOG_DATA);

  protected readonly styles = STYLE_CHOICES;
  protected readonly today = new Date().toISOString().slice(0, 10);
  private readonly submitting = new DialogSubmit();
  protected readonly busy = this.submitting.busy;
  protected readonly error = this.submitting.error;
  protected readonly form = new FormGroup(
    {
      style: new FormControl<ApplianceStyle | null>(this.data.appliance?.style ?? null, { validators: [Validators.required] }),
      model: new FormControl(this.data.appliance?.model ?? '', { nonNullable: true, validators: [Validators.maxLength(120)] }),
      serial: new FormControl(this.data.appliance?.serial ?? '', { nonNullable: true, validators: [Validators.maxLength(120)] }),
      installedOn: new FormControl(this.data.appliance?.installedOn ?? '', { nonNullable: true }),
      warrantyEndsOn: new FormControl(this.data.appliance?.warrantyEndsOn ?? '', { nonNullable: true }),
    },
    { validators: datesInOrder },
  );

  protected submit(): Promise<void> {
    return this.submitting.run(
      this.form,
      async () => {
        const values = this.form.getRawValue();
        const fields = {
          style: values.style as ApplianceStyle,
          model: values.model.trim(),
          serial: values.serial.trim(),
          installedOn: values.installedOn || null,
          warrantyEndsOn: values.warrantyEndsOn || null,
        };
        const current = this.data.appliance;
        const saved = current ? await firstValueFrom(this.api.change(current.id, fields)) : await firstValueFrom(this.api.create({ unitId: this.data.unitId, ...fields }));
        this.dialog.close(saved);
      },
      (error) => Object.values(fieldErrors(error))[0] ?? errorMessage(error),
    );
  }
}
