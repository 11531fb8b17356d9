import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { PASSWORD_MIN_LENGTH } from '../../../shared/api/password-rules';
import { AuthApi } from '../core/auth/auth-api';
import { fieldMessagesOf, matchingPasswordsValidator, messageOf, newPasswordValidator } from './password-validators';

/**
 * Opened from the reset e-mail. The link's token is in the URL fragment (never sent to the
 * server with the page request); it goes to the API in the request body.
 */
@Component({
  selector: 'cw-reset-password-page',
  imports: [MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule, RouterLink],
  templateUrl: './reset-password-page.html',
  styleUrl: './auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordPage {
  private readonly api = inject(AuthApi);
  protected readonly token = inject(ActivatedRoute).snapshot.fragment ?? '';
  protected readonly minLength = PASSWORD_MIN_LENGTH;

  protected readonly form = new FormGroup(
    {
      password: new FormControl('', { nonNullable: true, validators: [Validators.required, newPasswordValidator] }),
      confirm: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    },
    { validators: matchingPasswordsValidator },
  );
  protected readonly busy = signal(false);
  protected readonly done = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly serverFieldError = signal<string | null>(null);

  protected async submit(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.serverFieldError.set(null);
    try {
      await firstValueFrom(this.api.resetPassword(this.token, this.form.controls.password.value));
      this.done.set(true);
    } catch (error) {
      const fieldMessage = fieldMessagesOf(error)['password'];
      if (fieldMessage) this.serverFieldError.set(fieldMessage);
      else this.error.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
