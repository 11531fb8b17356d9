import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { SYMPTOMS, type Symptom } from '../../../shared/api/tenant';
import type { WorkOrderView } from '../../../shared/api/work-orders';
import { STYLE_LABELS } from '../fleet/appliance-words';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { windowWords } from './work-order-words';

/** Where the job is, when the tenant can let the technician in, and what they reported. */
@Component({
  selector: 'cw-job-place',
  imports: [MatCardModule, MatIconModule, ZonedDatePipe],
  templateUrl: './job-place.html',
  styleUrl: './job-place.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobPlace {
  readonly job = input.required<WorkOrderView>();

  protected readonly styleLabels = STYLE_LABELS;
  protected readonly timeZone = computed(() => this.job().property.timeZone);
  protected readonly windows = computed(() => this.job().accessWindows.map((window) => windowWords(window, this.timeZone())));
  protected readonly symptoms = computed(() => this.job().symptoms.map((code) => SYMPTOMS[code as Symptom] ?? code));
}
