import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import { canonicalTimeZone, type PropertyChange, type PropertyView } from '../../../shared/api/inventory';
import { DialogSubmit, showFieldErrors } from './dialog-submit';
import { PropertyApi } from './property-api';

const TIME_ZONES: readonly string[] = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];

/** A time zone the browser knows by its IANA name. */
function timeZoneValidator(control: { value: string }) {
  return canonicalTimeZone(control.value ?? '') ? null : { timeZone: true };
}

type FieldName = 'name' | 'addressLine1' | 'addressLine2' | 'city' | 'region' | 'postalCode' | 'country' | 'timeZone';

/** Adds a property, or edits one (data: the property); closes with the saved property. */
@Component({
  selector: 'cw-property-dialog',
  imports: [MatAutocompleteModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './property-dialog.html',
  styleUrl: './dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PropertyDialog {
  private readonly api = inject(PropertyApi);
  private readonly dialog = inject<MatDialogRef<PropertyDialog, PropertyView>>(MatDialogRef);
  protected readonly property = inject<PropertyView | null>(MAT_DIALOG_DATA);

  private readonly submitting = new DialogSubmit();
  protected readonly busy = this.submitting.busy;
  protected readonly error = this.submitting.error;
  protected readonly serverErrors = signal<Partial<Record<FieldName, string>>>({});
  protected readonly form = new FormGroup({
    name: new FormControl(this.property?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    addressLine1: new FormControl(this.property?.addressLine1 ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
    addressLine2: new FormControl(this.property?.addressLine2 ?? '', { nonNullable: true, validators: [Validators.maxLength(200)] }),
    city: new FormControl(this.property?.city ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(100)] }),
    region: new FormControl(this.property?.region ?? '', { nonNullable: true, validators: [Validators.maxLength(100)] }),
    postalCode: new FormControl(this.property?.postalCode ?? '', { nonNullable: true, validators: [Validators.maxLength(20)] }),
    country: new FormControl(this.property?.country ?? 'US', { nonNullable: true, validators: [Validators.required, Validators.pattern(/^[A-Za-z]{2}$/)] }),
    timeZone: new FormControl(this.property?.timeZone ?? guessTimeZone(), { nonNullable: true, validators: [Validators.required, timeZoneValidator] }),
  });
  private readonly zoneText = toSignal(this.form.controls.timeZone.valueChanges, { initialValue: this.form.controls.timeZone.value });
  /** Suggestions while typing: "chicago" finds America/Chicago. */
  protected readonly zoneOptions = computed(() => {
    const text = this.zoneText().trim().toLowerCase().replace(/\s+/g, '_');
    return (text ? TIME_ZONES.filter((zone) => zone.toLowerCase().includes(text)) : TIME_ZONES).slice(0, 30);
  });

  protected submit(): Promise<void> {
    return this.submitting.run(
      this.form,
      async () => {
        this.serverErrors.set({});
        const values = this.form.getRawValue();
        const input = { ...values, addressLine2: values.addressLine2.trim() || null, country: values.country.toUpperCase() };
        const saved = this.property ? await firstValueFrom(this.api.change(this.property.id, changedFields(this.property, input))) : await firstValueFrom(this.api.create(input));
        this.dialog.close(saved);
      },
      showFieldErrors(this.serverErrors),
    );
  }
}

function guessTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone ?? '';
}

/** Only what changed goes to the server; an unchanged form still sends its name so the request is valid. */
function changedFields(before: PropertyView, after: Required<PropertyChange>): PropertyChange {
  const change: PropertyChange = {};
  for (const key of Object.keys(after) as (keyof PropertyChange)[]) {
    if ((after[key] ?? null) !== (before[key] ?? null)) Object.assign(change, { [key]: after[key] });
  }
  return Object.keys(change).length ? change : { name: after.name };
}
