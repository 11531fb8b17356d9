import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatStepperModule } from '@angular/material/stepper';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import { formatZoned } from '../fleet/zoned-date';
import { PROGRESS_STEPS, progressStep, stepDetails } from './home-words';

/** Where a repair request stands: received → dispatched → scheduled (with the time) → completed. */
@Component({
  selector: 'cw-request-progress',
  imports: [MatIconModule, MatStepperModule],
  templateUrl: './request-progress.html',
  styleUrl: './request-progress.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestProgress {
  readonly request = input.required<ServiceRequestView>();
  readonly timeZone = input<string | null>(null);

  protected readonly labels = PROGRESS_STEPS;
  protected readonly current = computed(() => progressStep(this.request().progress));
  protected readonly cancelled = computed(() => this.current() < 0);
  protected readonly details = computed(() => stepDetails(this.request(), (iso) => formatZoned(iso, this.timeZone(), 'short')));
  /** The step on screen: the current one; a finished request shows its last step. */
  protected readonly selected = computed(() => Math.max(0, this.current()));
}
