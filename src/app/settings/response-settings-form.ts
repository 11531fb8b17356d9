import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { catchError, firstValueFrom, map, of } from 'rxjs';
import type { OrgSettings, OrgSettingsView, UpdateOrgSettingsRequest } from '../../../shared/api/work-orders';
import type { Severity } from '../../../shared/domain';
import { capitalise, errorMessage } from '../inventory/messages';
import { SettingsApi } from './settings-api';

const MINUTES_PER_HOUR = 60;

/** Hours where people think in hours; stored as minutes by the work-order settings. */
const hours = (minutes: number) => Math.round((minutes / MINUTES_PER_HOUR) * 10) / 10;

/**
 * Response targets and escalation times of the organization (the work-order settings,
 * `/api/org-settings`): when a work order is due, when an unaccepted urgent job goes to
 * the backup contractor, how long a repair has to prove itself.
 */
@Component({
  selector: 'cw-response-settings-form',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './response-settings-form.html',
  styleUrls: ['./settings-section.scss', './response-settings-form.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResponseSettingsForm {
  private readonly api = inject(SettingsApi);

  protected readonly view = signal<OrgSettingsView | null>(null);
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly saved = signal<string | null>(null);
  protected readonly severities: { value: Severity; label: string }[] = [
    { value: 'watch', label: 'Watch or worse' },
    { value: 'urgent', label: 'Urgent or worse' },
    { value: 'critical', label: 'Critical only' },
  ];
  protected readonly form = new FormGroup({
    urgentHours: new FormControl<number | null>(null, [Validators.required, Validators.min(0.5), Validators.max(7 * 24)]),
    routineHours: new FormControl<number | null>(null, [Validators.required, Validators.min(1), Validators.max(60 * 24)]),
    escalateAfterMinutes: new FormControl<number | null>(null, [Validators.required, Validators.min(1), Validators.max(24 * 60)]),
    dispatchHoldMinutes: new FormControl<number | null>(null, [Validators.required, Validators.min(0), Validators.max(24 * 60)]),
    verificationWindowHours: new FormControl<number | null>(null, [Validators.required, Validators.min(1), Validators.max(7 * 24)]),
    verificationHoldMinutes: new FormControl<number | null>(null, [Validators.required, Validators.min(1), Validators.max(24 * 60)]),
    autoOpenSeverity: new FormControl<Severity>('watch', { nonNullable: true }),
  });

  constructor() {
    this.api
      .orgSettings()
      .pipe(
        map((view) => ({ view, error: null as string | null })),
        catchError((error: unknown) => of({ view: null, error: errorMessage(error) })),
        takeUntilDestroyed(),
      )
      .subscribe(({ view, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (view) this.show(view);
      });
  }

  protected reason(key: keyof OrgSettings): string {
    return capitalise(this.view()?.reasons[key] ?? '');
  }

  protected defaultOf(key: 'urgent' | 'routine' | 'escalate' | 'dispatch' | 'window' | 'hold'): string {
    const d = this.view()?.defaults;
    if (!d) return '';
    const text: Record<typeof key, string> = {
      urgent: `${hours(d.responseMinutes.urgent)} h`,
      routine: `${hours(d.responseMinutes.routine)} h`,
      escalate: `${d.escalateAfterMinutes} min`,
      dispatch: `${d.dispatchHoldMinutes} min`,
      window: `${hours(d.verificationWindowMinutes)} h`,
      hold: `${d.verificationHoldMinutes} min`,
    };
    return text[key];
  }

  protected async save(): Promise<void> {
    if (this.form.invalid || this.saving()) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const change: UpdateOrgSettingsRequest = {
      responseMinutes: { urgent: Math.round(v.urgentHours! * MINUTES_PER_HOUR), routine: Math.round(v.routineHours! * MINUTES_PER_HOUR) },
      escalateAfterMinutes: Math.round(v.escalateAfterMinutes!),
      dispatchHoldMinutes: Math.round(v.dispatchHoldMinutes!),
      verificationWindowMinutes: Math.round(v.verificationWindowHours! * MINUTES_PER_HOUR),
      verificationHoldMinutes: Math.round(v.verificationHoldMinutes!),
      autoOpenSeverity: v.autoOpenSeverity,
    };
    this.saving.set(true);
    this.error.set(null);
    this.saved.set(null);
    try {
      this.show(await firstValueFrom(this.api.updateOrgSettings(change)));
      this.saved.set('Response targets and escalation times are saved.');
    } catch (error) {
      this.error.set(errorMessage(error));
    } finally {
      this.saving.set(false);
    }
  }

  private show(view: OrgSettingsView): void {
    this.view.set(view);
    const s = view.settings;
    this.form.setValue({
      urgentHours: hours(s.responseMinutes.urgent),
      routineHours: hours(s.responseMinutes.routine),
      escalateAfterMinutes: s.escalateAfterMinutes,
      dispatchHoldMinutes: s.dispatchHoldMinutes,
      verificationWindowHours: hours(s.verificationWindowMinutes),
      verificationHoldMinutes: s.verificationHoldMinutes,
      autoOpenSeverity: s.autoOpenSeverity,
    });
  }
}
