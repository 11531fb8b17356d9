import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule, type MatSlideToggleChange } from '@angular/material/slide-toggle';
import { catchError, firstValueFrom, map, of } from 'rxjs';
import { errorMessage } from '../inventory/messages';
import { SettingsApi } from './settings-api';

/** The signed-in manager's e-mail choice: urgent messages always go out. */
@Component({
  selector: 'cw-email-preferences',
  imports: [MatIconModule, MatProgressBarModule, MatSlideToggleModule],
  template: `
    <section class="section" aria-labelledby="email-title">
      <header class="section-head">
        <div>
          <h2 id="email-title">E-mail</h2>
          <p class="muted">Your own choice, not the organization's. Urgent messages (food at risk, a job nobody accepted) always reach you.</p>
        </div>
      </header>
      <div class="progress">
        @if (loading() || saving()) {
          <mat-progress-bar mode="indeterminate" [attr.aria-label]="loading() ? 'Loading your e-mail choice' : 'Saving'" />
        }
      </div>
      @if (error(); as message) {
        <p class="message error" role="alert"><mat-icon aria-hidden="true">error</mat-icon><span>{{ message }}</span></p>
      }
      @if (muted() !== null) {
        <mat-slide-toggle [checked]="!muted()" (change)="set($event)" [disabled]="saving()">E-mail me routine updates too (new requests, scheduled visits, completed jobs)</mat-slide-toggle>
        <p class="saved" role="status" aria-live="polite">{{ saved() }}</p>
      }
    </section>
  `,
  styleUrl: './settings-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmailPreferences {
  private readonly api = inject(SettingsApi);

  protected readonly muted = signal<boolean | null>(null);
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly saved = signal('');

  constructor() {
    this.api
      .notificationPreference()
      .pipe(
        map((preference) => ({ muted: preference.muteNonUrgent, error: null as string | null })),
        catchError((error: unknown) => of({ muted: null, error: errorMessage(error) })),
        takeUntilDestroyed(),
      )
      .subscribe(({ muted, error }) => {
        this.loading.set(false);
        this.muted.set(muted);
        this.error.set(error);
      });
  }

  protected async set(change: MatSlideToggleChange): Promise<void> {
    const muteNonUrgent = !change.checked;
    this.saving.set(true);
    this.error.set(null);
    try {
      const saved = await firstValueFrom(this.api.setNotificationPreference({ muteNonUrgent }));
      this.muted.set(saved.muteNonUrgent);
      this.saved.set(saved.muteNonUrgent ? 'Only urgent e-mail from now on.' : 'You will get routine updates too.');
    } catch (error) {
      change.source.checked = !change.checked;
      this.error.set(errorMessage(error));
    } finally {
      this.saving.set(false);
    }
  }
}
