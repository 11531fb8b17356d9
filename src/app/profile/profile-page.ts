import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar, MatSnackBarModule } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import type { Profile } from '../../../shared/api/auth';
import { PASSWORD_MIN_LENGTH } from '../../../shared/api/password-rules';
import type { TemperatureUnit } from '../../../shared/temperature';
import { fieldMessagesOf, matchingPasswordsValidator, messageOf, newPasswordValidator } from '../auth/password-validators';
import { Session } from '../core/auth/session';
import { ProfileApi } from './profile-api';

type Section = 'details' | 'email' | 'password';

const ROLE_WORDS = { manager: 'Property manager', contractor: 'Contractor', tenant: 'Tenant' } as const;

/** Every IANA zone the browser knows, for the time-zone list. */
function timeZones(): string[] {
  const intl = Intl as unknown as { supportedValuesOf?: (key: string) => string[] };
  return intl.supportedValuesOf?.('timeZone') ?? ['UTC', 'America/New_York', 'America/Chicago', 'America/Denver', 'America/Los_Angeles'];
}

/** Name, phone, units and time zone; e-mail address and password, each confirmed with the current password. */
@Component({
  selector: 'cw-profile-page',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatCardModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSnackBarModule,
    ReactiveFormsModule,
  ],
  templateUrl: './profile-page.html',
  styleUrl: './profile-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfilePage {
  private readonly api = inject(ProfileApi);
  private readonly session = inject(Session);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly timeZones = timeZones();
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly profile = signal<Profile | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly busy = signal<Section | null>(null);
  /** The last failure: which form, its message, and the server's field messages. */
  protected readonly failure = signal<{ section: Section; message: string; fields: Record<string, string> } | null>(null);

  protected readonly details = new FormGroup({
    displayName: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    phone: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(40), Validators.pattern(/^[0-9+().\-\s]*$/)] }),
    temperatureUnit: new FormControl<TemperatureUnit>('F', { nonNullable: true }),
    timeZone: new FormControl<string | null>(null),
  });
  protected readonly email = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
    currentPassword: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
  });
  protected readonly password = new FormGroup(
    {
      currentPassword: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
      password: new FormControl('', { nonNullable: true, validators: [Validators.required, newPasswordValidator] }),
      confirm: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    },
    { validators: matchingPasswordsValidator },
  );

  constructor() {
    this.api.get().subscribe({ next: (profile) => this.show(profile), error: (error: unknown) => this.loadError.set(messageOf(error)) });
  }

  protected errorOf(section: Section, field?: string): string | null {
    const failure = this.failure();
    if (failure?.section !== section) return null;
    return field ? (failure.fields[field] ?? null) : failure.message;
  }

  protected roleWords(profile: Profile): string {
    return ROLE_WORDS[profile.role] + (profile.isAdmin ? ' · administrator' : '');
  }

  protected saveDetails(): Promise<void> {
    return this.run('details', this.details, async () => {
      const { displayName, phone, temperatureUnit, timeZone } = this.details.getRawValue();
      const profile = await firstValueFrom(this.api.update({ displayName: displayName.trim(), phone: phone.trim(), temperatureUnit, timeZone }));
      this.show(profile);
      this.session.update({ displayName: profile.displayName, temperatureUnit: profile.temperatureUnit, timeZone: profile.timeZone });
      return 'Your details are saved.';
    });
  }

  protected saveEmail(): Promise<void> {
    return this.run('email', this.email, async () => {
      const { email, currentPassword } = this.email.getRawValue();
      const profile = await firstValueFrom(this.api.changeEmail(email, currentPassword));
      this.show(profile);
      this.session.update({ email: profile.email });
      this.email.reset({ email: '', currentPassword: '' });
      return `You now sign in with ${profile.email}.`;
    });
  }

  protected savePassword(): Promise<void> {
    return this.run('password', this.password, async () => {
      const { currentPassword, password } = this.password.getRawValue();
      await firstValueFrom(this.api.changePassword(currentPassword, password));
      this.password.reset({ currentPassword: '', password: '', confirm: '' });
      return 'Your password is changed. Other sessions were signed out.';
    });
  }

  private show(profile: Profile): void {
    this.profile.set(profile);
    this.details.reset({ displayName: profile.displayName, phone: profile.phone, temperatureUnit: profile.temperatureUnit, timeZone: profile.timeZone });
  }

  private async run(section: Section, form: FormGroup, work: () => Promise<string>): Promise<void> {
    if (form.invalid || this.busy()) {
      form.markAllAsTouched();
      return;
    }
    this.busy.set(section);
    this.failure.set(null);
    try {
      this.snackBar.open(await work(), 'OK', { duration: 5000 });
    } catch (error) {
      const fields = fieldMessagesOf(error);
      this.failure.set({ section, fields, message: Object.keys(fields).length ? 'Check the fields marked below.' : messageOf(error) });
    } finally {
      this.busy.set(null);
    }
  }
}
