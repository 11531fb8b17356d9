import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';
import type { UserSummary } from '../../../shared/api/users';
import type { Role } from '../../../shared/domain';
import { fieldMessagesOf, messageOf } from '../auth/password-validators';
import { RoleFieldGroup } from './role-field-group';
import { UsersApi } from './users-api';

/** Changes a user's role, unit or admin flag; closes with the updated user. */
@Component({
  selector: 'cw-change-role-dialog',
  imports: [MatButtonModule, MatDialogModule, ReactiveFormsModule, RoleFieldGroup],
  templateUrl: './change-role-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeRoleDialog {
  private readonly api = inject(UsersApi);
  private readonly dialog = inject<MatDialogRef<ChangeRoleDialog, UserSummary>>(MatDialogRef);
  protected readonly user = inject<UserSummary>(MAT_DIALOG_DATA);

  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected readonly form = new FormGroup({
    role: new FormControl<Role>(this.user.role, { nonNullable: true }),
    unitId: new FormControl<string | null>(this.user.unit?.id ?? null),
    isAdmin: new FormControl(this.user.isAdmin, { nonNullable: true }),
  });

  protected async submit(): Promise<void> {
    const { role, unitId, isAdmin } = this.form.getRawValue();
    if (role === 'tenant' && !unitId) {
      this.form.controls.unitId.setErrors({ required: true });
      this.form.markAllAsTouched();
      return;
    }
    if (this.busy()) return;
    this.busy.set(true);
    this.error.set(null);
    try {
      const change = role === 'tenant' ? { role, unitId } : role === 'manager' ? { role, isAdmin } : { role };
      this.dialog.close(await firstValueFrom(this.api.change(this.user.id, change)));
    } catch (error) {
      this.error.set(Object.values(fieldMessagesOf(error))[0] ?? messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
