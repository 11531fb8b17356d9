import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { STEPPER_GLOBAL_OPTIONS } from '@angular/cdk/stepper';
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
  // Our own indicators: a tick for steps behind, the number for the step it stands at, a tick on the last once finished.
  providers: [{ provide: STEPPER_GLOBAL_OPTIONS, useValue: { displayDefaultIndicatorType: false } }],
})
export class RequestProgress {
  readonly request = input.required<ServiceRequestView>();
  readonly timeZone = input<string | null>(null);

  protected readonly labels = PROGRESS_STEPS;
  protected readonly current = computed(() => progressStep(this.request().progress));
  protected readonly cancelled = computed(() => this.current() < 0);
  protected readonly details = computed(() => stepDetails(this.request(), (iso) => formatZoned(iso, this.timeZone(), 'short')));
  /** Reports a tenant added to the request, counted, with the latest one's time. */
  protected readonly reportsLine = computed(() => {
    const reports = this.request().reports;
    if (!reports.length) return null;
    const latest = reports.map((report) => report.createdAt).sort().at(-1) ?? null;
    const count = reports.length === 1 ? 'One report' : `${reports.length} reports`;
    return `${count} from your unit on this request, the latest on ${formatZoned(latest, this.timeZone(), 'short')}.`;
  });
  /** The step on screen: the current one; a finished request shows its last step. */
  protected readonly selected = computed(() => Math.max(0, this.current()));
  protected readonly finished = computed(() => this.current() === PROGRESS_STEPS.length - 1);
}
