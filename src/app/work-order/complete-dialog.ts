import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { CauseFound, CompleteRequest } from '../../../shared/api/work-orders';
import type { CauseCode } from '../../../shared/domain';
import { CAUSE_FOUND_OPTIONS } from './work-order-words';

export interface CompleteDialogData {
  suspectedCause: CauseCode | null;
  findings: string;
  notes: string;
}

/** Completing the job: the cause found (from the cause codes, or something else said in words) and the findings. */
@Component({
  selector: 'cw-complete-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './complete-dialog.html',
  styles: `.full { width: 100%; } .hint { color: var(--mat-sys-on-surface-variant); }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CompleteDialog {
  private readonly ref = inject<MatDialogRef<CompleteDialog, CompleteRequest>>(MatDialogRef);
  private readonly data = inject<CompleteDialogData>(MAT_DIALOG_DATA);

  protected readonly options = CAUSE_FOUND_OPTIONS;
  protected readonly form = new FormGroup({
    causeFound: new FormControl<CauseFound | null>(this.data.suspectedCause, Validators.required),
    causeNote: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(1000)] }),
    findings: new FormControl(this.data.findings, { nonNullable: true, validators: [Validators.required, Validators.maxLength(8000)] }),
    notes: new FormControl(this.data.notes, { nonNullable: true, validators: [Validators.maxLength(8000)] }),
  });
  protected readonly cause = toSignal(this.form.controls.causeFound.valueChanges, { initialValue: this.form.controls.causeFound.value });

  protected submit(): void {
    const { causeFound, causeNote, findings, notes } = this.form.getRawValue();
    const noteMissing = causeFound === 'other' && !causeNote.trim();
    if (noteMissing) this.form.controls.causeNote.setErrors({ required: true });
    if (!findings.trim()) this.form.controls.findings.setErrors({ required: true });
    if (this.form.invalid || noteMissing || !causeFound) {
      this.form.markAllAsTouched();
      return;
    }
    this.ref.close({
      causeFound,
      ...(causeFound === 'other' || causeNote.trim() ? { causeNote: causeNote.trim() } : {}),
      findings: findings.trim(),
      notes,
    });
  }
}
