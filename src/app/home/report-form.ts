import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import { SYMPTOMS, SYMPTOM_CODES, TENANT_PHOTO_LIMIT, type Symptom, type TenantApplianceView, type TenantReportInput, type TenantReportResult } from '../../../shared/api/tenant';
import { STYLE_LABELS } from '../fleet/appliance-words';
import { errorMessage } from '../inventory/messages';
import { PHOTO_TYPES, describedWhenOther, localToIso, pickPhotos, someTicked, windowInOrder } from './report-validators';
import { RequestProgress } from './request-progress';
import { TenantHomeApi } from './tenant-home-api';

type AccessWindowGroup = FormGroup<{ from: FormControl<string>; to: FormControl<string> }>;

function symptomControls(): Record<Symptom, FormControl<boolean>> {
  return Object.fromEntries(SYMPTOM_CODES.map((code) => [code, new FormControl(false, { nonNullable: true })])) as Record<Symptom, FormControl<boolean>>;
}

/**
 * The problem report: what is wrong, in words and photos, when a technician may come in and
 * whether a pet is at home. A report on an appliance with an open request joins that request.
 */
@Component({
  selector: 'cw-report-form',
  imports: [MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule, RequestProgress],
  templateUrl: './report-form.html',
  styleUrl: './report-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportForm {
  private readonly api = inject(TenantHomeApi);

  readonly appliances = input.required<TenantApplianceView[]>();
  readonly timeZone = input<string | null>(null);
  readonly sent = output<TenantReportResult>();

  protected readonly symptoms = SYMPTOM_CODES.map((code) => ({ code, label: SYMPTOMS[code] }));
  protected readonly styleLabels = STYLE_LABELS;
  protected readonly photoTypes = PHOTO_TYPES.join(',');
  protected readonly photoLimit = TENANT_PHOTO_LIMIT;
  protected readonly form = new FormGroup({
    applianceId: new FormControl('', { nonNullable: true }),
    symptoms: new FormGroup(symptomControls(), { validators: someTicked }),
    description: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(4000), describedWhenOther] }),
    accessWindows: new FormArray<AccessWindowGroup>([]),
    petPresent: new FormControl(false, { nonNullable: true }),
  });
  protected readonly photos = signal<File[]>([]);
  protected readonly photoProblem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly result = signal<TenantReportResult | null>(null);

  private readonly chosenId = toSignal(this.form.controls.applianceId.valueChanges, { initialValue: '' });
  protected readonly several = computed(() => this.appliances().length > 1);
  /** The appliance the report is about: the only one, or the one chosen. */
  protected readonly chosen = computed(() => (this.several() ? this.appliances().find((a) => a.id === this.chosenId()) : this.appliances()[0]) ?? null);
  protected readonly openRequest = computed(() => this.chosen()?.openRequest ?? null);

  constructor() {
    // The description's rule depends on the "something else" box.
    this.form.controls.symptoms.controls.other.valueChanges.pipe(takeUntilDestroyed(inject(DestroyRef))).subscribe(() => this.form.controls.description.updateValueAndValidity());
  }

  protected addWindow(): void {
    const group: AccessWindowGroup = new FormGroup(
      { from: new FormControl('', { nonNullable: true, validators: Validators.required }), to: new FormControl('', { nonNullable: true, validators: Validators.required }) },
      { validators: windowInOrder },
    );
    this.form.controls.accessWindows.push(group);
  }

  protected removeWindow(index: number): void {
    this.form.controls.accessWindows.removeAt(index);
  }

  protected addPhotos(event: Event): void {
    const element = event.target as HTMLInputElement;
    const { kept, problem } = pickPhotos(this.photos(), Array.from(element.files ?? []));
    this.photos.set(kept);
    this.photoProblem.set(problem);
    element.value = ''; // the same picture can be picked again after removing it
  }

  protected removePhoto(file: File): void {
    this.photos.update((photos) => photos.filter((photo) => photo !== file));
    this.photoProblem.set(null);
  }

  protected async submit(): Promise<void> {
    if (this.busy()) return;
    const appliance = this.chosen();
    if (this.form.invalid || !appliance) {
      this.form.markAllAsTouched();
      this.error.set(appliance ? 'Check the marked parts of the form.' : 'Choose the appliance the problem is with.');
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    try {
      const result = await firstValueFrom(this.api.report(this.reportOf(appliance.id), this.photos()));
      this.result.set(result);
      this.sent.emit(result);
    } catch (error) {
      this.error.set(errorMessage(error));
    } finally {
      this.busy.set(false);
    }
  }

  protected startOver(): void {
    this.form.reset();
    this.form.controls.accessWindows.clear();
    this.photos.set([]);
    this.photoProblem.set(null);
    this.error.set(null);
    this.result.set(null);
  }

  private reportOf(applianceId: string): TenantReportInput {
    const value = this.form.getRawValue();
    return {
      applianceId,
      symptoms: SYMPTOM_CODES.filter((code) => value.symptoms[code]),
      description: value.description.trim(),
      accessWindows: value.accessWindows.map((window) => ({ from: localToIso(window.from), to: localToIso(window.to) })),
      petPresent: value.petPresent,
    };
  }
}
