import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import type { InvitationSummary } from '../../../shared/api/users';
import type { Role } from '../../../shared/domain';
import { fieldMessagesOf, messageOf } from '../auth/password-validators';
import { RoleFieldGroup } from './role-field-group';
import { UsersApi } from './users-api';

/** Invites someone by e-mail; closes with the new invitation. */
@Component({
  selector: 'cw-invite-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule, RoleFieldGroup],
  templateUrl: './invite-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteDialog {
  private readonly api = inject(UsersApi);
  private readonly dialog = inject<MatDialogRef<InviteDialog, InvitationSummary>>(MatDialogRef);

  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected readonly form = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
    displayName: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    role: new FormControl<Role>('tenant', { nonNullable: true }),
    unitId: new FormControl<string | null>(null),
    isAdmin: new FormControl(false, { nonNullable: true }),
  });

  protected async submit(): Promise<void> {
    const { email, displayName, role, unitId, isAdmin } = this.form.getRawValue();
    // A unit is required only for a tenant, so it is checked here rather than by a validator.
    this.form.controls.unitId.setErrors(role === 'tenant' && !unitId ? { required: true } : null);
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    try {
      const invitation = await firstValueFrom(
        this.api.invite({ email, displayName: displayName.trim(), role, unitId: role === 'tenant' ? unitId : null, isAdmin: role === 'manager' ? isAdmin : false }),
      );
      this.dialog.close(invitation);
    } catch (error) {
      this.error.set(Object.values(fieldMessagesOf(error))[0] ?? messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
