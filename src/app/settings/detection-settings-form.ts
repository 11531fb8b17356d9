import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { catchError, firstValueFrom, map, of } from 'rxjs';
import { fieldsFor, type DetectionFieldView, type DetectionOverrides, type DetectionSettingKey, type DetectionSettingsView, type StyleSettingsView } from '../../../shared/api/settings';
import type { ApplianceStyle } from '../../../shared/domain';
import type { TemperatureUnit } from '../../../shared/temperature';
import { Session } from '../core/auth/session';
import { STYLE_CHOICES, STYLE_LABELS } from '../inventory/labels';
import { errorMessage } from '../inventory/messages';
import { SettingsApi } from './settings-api';
import { displayBounds, fromDisplay, toDisplay, unitSuffix } from './setting-units';

interface FieldRow {
  field: DetectionFieldView;
  control: FormControl<number | null>;
  min: number;
  max: number;
  step: number;
  suffix: string;
  defaultText: string;
}

/** Thresholds and grace periods of one appliance style, in the person's °F or °C, over the defaults. */
@Component({
  selector: 'cw-detection-settings-form',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './detection-settings-form.html',
  styleUrls: ['./settings-section.scss', './detection-settings-form.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DetectionSettingsForm {
  private readonly api = inject(SettingsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly session = inject(Session);

  protected readonly styles = STYLE_CHOICES;
  protected readonly styleControl = new FormControl<ApplianceStyle>('top-freezer', { nonNullable: true });
  protected readonly view = signal<DetectionSettingsView | null>(null);
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly saved = signal<string | null>(null);
  protected readonly style = signal<ApplianceStyle>('top-freezer');
  protected readonly unit = computed<TemperatureUnit>(() => this.session.user()?.temperatureUnit ?? 'F');
  protected readonly current = computed<StyleSettingsView | null>(() => this.view()?.styles.find((s) => s.style === this.style()) ?? null);
  protected readonly form = new FormGroup<Partial<Record<DetectionSettingKey, FormControl<number | null>>>>({});
  protected readonly rows = signal<FieldRow[]>([]);
  protected readonly styleLabel = (style: ApplianceStyle) => STYLE_LABELS[style];

  constructor() {
    this.styleControl.valueChanges.pipe(takeUntilDestroyed()).subscribe((style) => {
      this.style.set(style);
      this.saved.set(null);
      this.buildForm();
    });
    this.api
      .detection()
      .pipe(
        map((view) => ({ view, error: null as string | null })),
        catchError((error: unknown) => of({ view: null, error: errorMessage(error) })),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe(({ view, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (view) this.show(view);
      });
  }

  protected overridden(row: FieldRow): boolean {
    return this.current()?.overrides[row.field.key] !== undefined;
  }

  protected async save(): Promise<void> {
    if (this.form.invalid || this.saving()) {
      this.form.markAllAsTouched();
      return;
    }
    await this.run(() => this.api.replaceDetection(this.style(), this.overridesFromForm()), `Settings for ${this.styleLabel(this.style()).toLowerCase()}s are saved.`);
  }

  protected async reset(): Promise<void> {
    await this.run(() => this.api.resetDetection(this.style()), `${this.styleLabel(this.style())}s use the defaults again.`);
  }

  private async run(call: () => ReturnType<SettingsApi['resetDetection']>, success: string): Promise<void> {
    this.saving.set(true);
    this.error.set(null);
    this.saved.set(null);
    try {
      this.show(await firstValueFrom(call()));
      this.saved.set(success);
    } catch (error) {
      this.error.set(errorMessage(error));
    } finally {
      this.saving.set(false);
    }
  }

  private show(view: DetectionSettingsView): void {
    this.view.set(view);
    this.buildForm();
  }

  /** One control per setting the style has, holding the override or the default, in display units. */
  private buildForm(): void {
    const view = this.view();
    const current = this.current();
    if (!view || !current) return;
    const unit = this.unit();
    const applicable = new Set(fieldsFor(current.probes).map((field) => field.key));
    const rows = view.fields
      .filter((field) => applicable.has(field.key))
      .map((field): FieldRow => {
        const { min, max } = displayBounds(field, unit);
        const value = current.overrides[field.key] ?? field.defaultValue;
        const control = new FormControl<number | null>(toDisplay(field, value, unit), { validators: [Validators.required, Validators.min(min), Validators.max(max)] });
        const suffix = unitSuffix(field, unit);
        return { field, control, min, max, step: field.kind === 'minutes' ? 1 : 0.1, suffix, defaultText: `${toDisplay(field, field.defaultValue, unit)} ${suffix}` };
      });
    for (const key of Object.keys(this.form.controls)) this.form.removeControl(key as DetectionSettingKey);
    for (const row of rows) this.form.addControl(row.field.key, row.control);
    this.rows.set(rows);
  }

  /** Only values that differ from the default (as shown) become overrides. */
  private overridesFromForm(): DetectionOverrides {
    const unit = this.unit();
    const overrides: DetectionOverrides = {};
    for (const row of this.rows()) {
      const value = row.control.value;
      if (value === null || value === toDisplay(row.field, row.field.defaultValue, unit)) continue;
      overrides[row.field.key] = row.field.kind === 'minutes' ? Math.round(value) : fromDisplay(row.field, value, unit);
    }
    return overrides;
  }
}
