import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { Observable } from 'rxjs';
import type { WorkOrderView } from '../../../shared/api/work-orders';
import { formatMoney } from '../appliance/money';
import type { ApiError } from '../core/http/api-error.interceptor';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { WorkOrderApi } from './work-order-api';
import { COST_STATUS_LABELS } from './work-order-words';

/** The manager's decisions on a job: approve or dispute its cost (with a note), and confirm the repair by hand. */
@Component({
  selector: 'cw-cost-review',
  imports: [MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule, ZonedDatePipe],
  templateUrl: './cost-review.html',
  styleUrl: './job-actions.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CostReview {
  private readonly api = inject(WorkOrderApi);

  readonly job = input.required<WorkOrderView>();
  readonly changed = output<WorkOrderView>();

  protected readonly costLabels = COST_STATUS_LABELS;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly note = new FormControl('', { nonNullable: true, validators: Validators.maxLength(2000) });
  protected readonly total = computed(() => formatMoney(this.job().totals.total.cents, this.job().totals.total.currency));
  protected readonly canDecide = computed(() => this.job().costStatus !== 'none');
  protected readonly canVerify = computed(() => this.job().state === 'completed');

  protected approve(): void {
    this.run(this.api.approveCost(this.job().id, this.note.value.trim() || undefined));
  }

  protected dispute(): void {
    const note = this.note.value.trim();
    if (!note) {
      this.error.set('Say what is wrong with the cost in the note: the contractor reads it.');
      return;
    }
    this.run(this.api.disputeCost(this.job().id, note));
  }

  protected verify(): void {
    this.run(this.api.verify(this.job().id, this.note.value.trim() || undefined));
  }

  private run(call: Observable<WorkOrderView>): void {
    this.busy.set(true);
    this.error.set(null);
    call.subscribe({
      next: (view) => {
        this.busy.set(false);
        this.note.setValue('');
        this.changed.emit(view);
      },
      error: (failure: ApiError) => {
        this.busy.set(false);
        this.error.set(failure.message);
      },
    });
  }
}
