import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import type { ContractorView, UpdateContractorRequest } from '../../../shared/api/work-orders';
import { ContractorApi } from './contractor-api';
import { DialogSubmit, showFieldErrors } from './dialog-submit';

type FieldName = 'name' | 'email' | 'phone';

/** Adds a contractor company, or edits one (data: the contractor); closes with the saved one. */
@Component({
  selector: 'cw-contractor-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './contractor-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ContractorDialog {
  private readonly api = inject(ContractorApi);
  private readonly dialog = inject<MatDialogRef<ContractorDialog, ContractorView>>(MatDialogRef);
  protected readonly contractor = inject<ContractorView | null>(MAT_DIALOG_DATA);

  private readonly submitting = new DialogSubmit();
  protected readonly busy = this.submitting.busy;
  protected readonly error = this.submitting.error;
  protected readonly serverErrors = signal<Partial<Record<FieldName, string>>>({});
  protected readonly form = new FormGroup({
    name: new FormControl(this.contractor?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    email: new FormControl(this.contractor?.email ?? '', { nonNullable: true, validators: [Validators.required, Validators.email, Validators.maxLength(254)] }),
    phone: new FormControl(this.contractor?.phone ?? '', { nonNullable: true, validators: [Validators.maxLength(40)] }),
  });

  protected submit(): Promise<void> {
    return this.submitting.run(
      this.form,
      async () => {
        this.serverErrors.set({});
        const values = { name: this.form.controls.name.value.trim(), email: this.form.controls.email.value.trim(), phone: this.form.controls.phone.value.trim() };
        const saved = this.contractor ? await firstValueFrom(this.api.change(this.contractor.id, changedFields(this.contractor, values))) : await firstValueFrom(this.api.create(values));
        this.dialog.close(saved);
      },
      showFieldErrors(this.serverErrors),
    );
  }
}

/** Only what changed goes to the server; an unchanged form still sends its name so the request is valid. */
function changedFields(before: ContractorView, after: Record<FieldName, string>): UpdateContractorRequest {
  const change: Partial<Record<FieldName, string>> = {};
  for (const key of Object.keys(after) as FieldName[]) if (after[key] !== before[key]) change[key] = after[key];
  return Object.keys(change).length ? change : { name: after.name };
}
