import { ChangeDetectionStrategy, Component, effect, inject, input, output, signal, untracked } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { WorkOrderView } from '../../../shared/api/work-orders';
import type { ApiError } from '../core/http/api-error.interceptor';
import { WorkOrderApi } from './work-order-api';
import { causeFoundLabel } from './work-order-words';

/** The technician's findings and notes: written as the job goes, read by the manager. */
@Component({
  selector: 'cw-job-notes',
  imports: [MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './job-notes.html',
  styleUrl: './job-notes.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobNotes {
  private readonly api = inject(WorkOrderApi);

  readonly job = input.required<WorkOrderView>();
  readonly canEdit = input(false);
  readonly changed = output<WorkOrderView>();

  protected readonly causeFoundLabel = causeFoundLabel;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly saved = signal(false);
  protected readonly form = new FormGroup({
    findings: new FormControl('', { nonNullable: true, validators: Validators.maxLength(8000) }),
    notes: new FormControl('', { nonNullable: true, validators: Validators.maxLength(8000) }),
  });

  constructor() {
    // A reloaded job refreshes the fields, unless the technician is typing in them.
    effect(() => {
      const { findings, notes } = this.job();
      untracked(() => {
        if (!this.form.dirty) this.form.setValue({ findings, notes }, { emitEvent: false });
      });
    });
  }

  protected save(): void {
    if (this.form.invalid) return;
    const { findings, notes } = this.form.getRawValue();
    this.busy.set(true);
    this.error.set(null);
    this.api.update(this.job().id, { findings, notes }).subscribe({
      next: (view) => {
        this.busy.set(false);
        this.saved.set(true);
        this.form.markAsPristine();
        this.changed.emit(view);
      },
      error: (failure: ApiError) => {
        this.busy.set(false);
        this.error.set(failure.message);
      },
    });
  }
}
