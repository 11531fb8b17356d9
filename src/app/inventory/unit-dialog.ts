import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import type { UnitView } from '../../../shared/api/inventory';
import { DialogSubmit } from './dialog-submit';
import { UnitApi } from './unit-api';

export interface UnitDialogData {
  propertyId: string;
  propertyName: string;
  unit: UnitView | null;
}

/** Adds a unit to a property or edits one; closes with the saved unit. */
@Component({
  selector: 'cw-unit-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './unit-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnitDialog {
  private readonly api = inject(UnitApi);
  private readonly dialog = inject<MatDialogRef<UnitDialog, UnitView>>(MatDialogRef);
  protected readonly data = inject<UnitDialogData>(MAT_DIALOG_DATA);

  private readonly submitting = new DialogSubmit();
  protected readonly busy = this.submitting.busy;
  protected readonly error = this.submitting.error;
  protected readonly form = new FormGroup({
    label: new FormControl(this.data.unit?.label ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(40)] }),
    floor: new FormControl<number | null>(this.data.unit?.floor ?? null, { validators: [Validators.min(-10), Validators.max(300), Validators.pattern(/^-?\d+$/)] }),
  });

  protected submit(): Promise<void> {
    return this.submitting.run(this.form, async () => {
      const label = this.form.controls.label.value.trim();
      const floorValue = this.form.controls.floor.value;
      const floor = floorValue === null || String(floorValue) === '' ? null : Number(floorValue);
      const unit = this.data.unit;
      const saved = unit ? await firstValueFrom(this.api.change(unit.id, { label, floor })) : await firstValueFrom(this.api.create(this.data.propertyId, { label, floor }));
      this.dialog.close(saved);
    });
  }
}
