import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal, type WritableSignal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators, type AbstractControl, type FormGroupDirective, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { Observable } from 'rxjs';
import type { WorkOrderView } from '../../../shared/api/work-orders';
import { formatMoney } from '../appliance/money';
import type { ApiError } from '../core/http/api-error.interceptor';
import { parseMoneyToCents } from './form-values';
import { COST_STATUS_LABELS } from './work-order-words';
import { WorkOrderApi } from './work-order-api';

function money(control: AbstractControl<string>): ValidationErrors | null {
  return control.value === '' || parseMoneyToCents(control.value) !== null ? null : { money: true };
}

/** Parts and labour on the job with their cost in integer cents, and the forms to record more. */
@Component({
  selector: 'cw-job-costs',
  imports: [MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './job-costs.html',
  styleUrl: './job-costs.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobCosts {
  private readonly api = inject(WorkOrderApi);

  readonly job = input.required<WorkOrderView>();
  /** Whether this person may record parts and labour now (the contractor, while the job is open). */
  readonly canRecord = input(false);
  readonly changed = output<WorkOrderView>();

  protected readonly costLabels = COST_STATUS_LABELS;
  protected readonly busy = signal<'part' | 'labour' | null>(null);
  protected readonly partError = signal<string | null>(null);
  protected readonly labourError = signal<string | null>(null);
  protected readonly currency = computed(() => this.job().totals.total.currency);

  protected readonly partForm = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
    quantity: new FormControl<number | null>(1, [Validators.required, Validators.min(1), Validators.max(1000), Validators.pattern(/^\d+$/)]),
    unitCost: new FormControl('', { nonNullable: true, validators: [Validators.required, money] }),
  });
  protected readonly labourForm = new FormGroup({
    minutes: new FormControl<number | null>(null, [Validators.required, Validators.min(1), Validators.max(24 * 60), Validators.pattern(/^\d+$/)]),
    hourlyRate: new FormControl('', { nonNullable: true, validators: [Validators.required, money] }),
  });

  protected money(cents: number): string {
    return formatMoney(cents, this.currency());
  }

  /** Labour cost as the server counts it: minutes × hourly rate ÷ 60, rounded to the cent. */
  protected labourCents(minutes: number, hourlyRateCents: number): number {
    return Math.round((minutes * hourlyRateCents) / 60);
  }

  /** resetForm on the directive, not reset on the group: the submitted flag would keep every field showing its error. */
  protected addPart(directive: FormGroupDirective): void {
    if (this.partForm.invalid) {
      this.partForm.markAllAsTouched();
      return;
    }
    const { name, quantity, unitCost } = this.partForm.getRawValue();
    const body = { name: name.trim(), quantity: Number(quantity), unitCostCents: parseMoneyToCents(unitCost)!, currency: this.currency() };
    this.send('part', this.api.recordPart(this.job().id, body), this.partError, () => directive.resetForm({ name: '', quantity: 1, unitCost: '' }));
  }

  protected addLabour(directive: FormGroupDirective): void {
    if (this.labourForm.invalid) {
      this.labourForm.markAllAsTouched();
      return;
    }
    const { minutes, hourlyRate } = this.labourForm.getRawValue();
    const body = { minutes: Number(minutes), hourlyRateCents: parseMoneyToCents(hourlyRate)! };
    this.send('labour', this.api.recordLabour(this.job().id, body), this.labourError, () => directive.resetForm({ minutes: null, hourlyRate }));
  }

  private send(which: 'part' | 'labour', call: Observable<WorkOrderView>, error: WritableSignal<string | null>, reset: () => void): void {
    this.busy.set(which);
    error.set(null);
    call.subscribe({
      next: (view) => {
        this.busy.set(null);
        reset();
        this.changed.emit(view);
      },
      error: (failure: ApiError) => {
        this.busy.set(null);
        error.set(failure.message);
      },
    });
  }
}
