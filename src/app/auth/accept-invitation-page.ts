import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { InvitationPreview } from '../../../shared/api/auth';
import { PASSWORD_MIN_LENGTH } from '../../../shared/api/password-rules';
import { AuthApi } from '../core/auth/auth-api';
import { Session } from '../core/auth/session';
import { fieldMessagesOf, matchingPasswordsValidator, messageOf, newPasswordValidator } from './password-validators';

/**
 * Opened from the invitation e-mail: shows who invited whom to what, then the invitee
 * chooses a password and is signed in. The token comes from the URL fragment.
 */
@Component({
  selector: 'cw-accept-invitation-page',
  imports: [MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, ReactiveFormsModule, RouterLink],
  templateUrl: './accept-invitation-page.html',
  styleUrl: './auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitationPage {
  private readonly api = inject(AuthApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly token = inject(ActivatedRoute).snapshot.fragment ?? '';
  protected readonly minLength = PASSWORD_MIN_LENGTH;

  protected readonly preview = signal<InvitationPreview | null>(null);
  protected readonly loading = signal(true);
  protected readonly busy = signal(false);
  protected readonly linkError = signal<string | null>(null);
  protected readonly error = signal<string | null>(null);

  protected readonly form = new FormGroup(
    {
      displayName: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
      password: new FormControl('', { nonNullable: true, validators: [Validators.required, newPasswordValidator] }),
      confirm: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    },
    { validators: matchingPasswordsValidator },
  );

  constructor() {
    void this.load();
  }

  protected summaryOf(invitation: InvitationPreview): string {
    const unit = invitation.unitLabel ? ` of unit ${invitation.unitLabel}${invitation.propertyName ? ` at ${invitation.propertyName}` : ''}` : '';
    return `${invitation.organizationName} invited ${invitation.email} as a ${invitation.role}${unit}.`;
  }

  private async load(): Promise<void> {
    if (!this.token) {
      this.linkError.set('This page needs the link from your invitation e-mail.');
      this.loading.set(false);
      return;
    }
    try {
      const preview = await firstValueFrom(this.api.previewInvitation(this.token));
      this.preview.set(preview);
      this.form.controls.displayName.setValue(preview.displayName);
    } catch (error) {
      this.linkError.set(messageOf(error));
    } finally {
      this.loading.set(false);
    }
  }

  protected async submit(): Promise<void> {
    const preview = this.preview();
    if (!preview || this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    const { displayName, password } = this.form.getRawValue();
    try {
      const { email } = await firstValueFrom(this.api.acceptInvitation(this.token, password, displayName.trim()));
      await this.signInAs(email, password);
    } catch (error) {
      this.error.set(fieldMessagesOf(error)['password'] ?? messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }

  /** The account exists now; sign in with the password just chosen, or fall back to the sign-in page. */
  private async signInAs(email: string, password: string): Promise<void> {
    try {
      await this.session.signIn(email, password);
      await this.router.navigateByUrl(this.session.homePath());
    } catch {
      await this.router.navigate(['/sign-in'], { queryParams: { email, welcome: 1 } });
    }
  }
}
