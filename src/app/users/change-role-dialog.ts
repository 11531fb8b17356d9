import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { catchError, firstValueFrom, of } from 'rxjs';
import type { UserSummary } from '../../../shared/api/users';
import type { Role } from '../../../shared/domain';
import { fieldMessagesOf, messageOf } from '../auth/password-validators';
import { ROLE_CHOICES, unitLabel } from './role-fields';
import { UsersApi } from './users-api';

/** Changes a user's role, unit or admin flag; closes with the updated user. */
@Component({
  selector: 'cw-change-role-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './change-role-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeRoleDialog {
  private readonly api = inject(UsersApi);
  private readonly dialog = inject<MatDialogRef<ChangeRoleDialog, UserSummary>>(MatDialogRef);
  protected readonly user = inject<UserSummary>(MAT_DIALOG_DATA);

  protected readonly roles = ROLE_CHOICES;
  protected readonly unitLabel = unitLabel;
  protected readonly units = toSignal(this.api.unitOptions().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected readonly form = new FormGroup({
    role: new FormControl<Role>(this.user.role, { nonNullable: true }),
    unitId: new FormControl<string | null>(this.user.unit?.id ?? null),
    isAdmin: new FormControl(this.user.isAdmin, { nonNullable: true }),
  });
  protected readonly role = toSignal(this.form.controls.role.valueChanges, { initialValue: this.form.controls.role.value });

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
