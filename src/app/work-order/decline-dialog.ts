import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** Why the contractor turns the job down; the manager reads it and the job may pass to the backup. */
@Component({
  selector: 'cw-decline-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `<h2 mat-dialog-title>Decline this job?</h2>
    <form [formGroup]="form" (ngSubmit)="submit()">
      <mat-dialog-content>
        <p>The property manager is told at once, and the job may go to the backup contractor.</p>
        <mat-form-field appearance="outline" class="full">
          <mat-label>Reason</mat-label>
          <textarea matInput [formControl]="reason" rows="3" maxlength="1000" required cdkFocusInitial></textarea>
          @if (reason.touched && reason.invalid) {
            <mat-error>Say why, so the manager can plan.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Keep the job</button>
        <button mat-flat-button type="submit">Decline</button>
      </mat-dialog-actions>
    </form>`,
  styles: `.full { width: 100%; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeclineDialog {
  private readonly ref = inject<MatDialogRef<DeclineDialog, string>>(MatDialogRef);
  protected readonly reason = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(1000)] });
  protected readonly form = new FormGroup({ reason: this.reason });

  protected submit(): void {
    const reason = this.reason.value.trim();
    if (!reason) {
      this.reason.setValue('');
      this.reason.markAsTouched();
      return;
    }
    this.ref.close(reason);
  }
}
