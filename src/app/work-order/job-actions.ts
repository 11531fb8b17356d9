import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { type Observable, filter, switchMap } from 'rxjs';
import type { CompleteRequest, WorkOrderState, WorkOrderView } from '../../../shared/api/work-orders';
import type { ApiError } from '../core/http/api-error.interceptor';
import { CompleteDialog, type CompleteDialogData } from './complete-dialog';
import { DeclineDialog } from './decline-dialog';
import { isoToWallTime, wallTimeToIso } from './form-values';
import { WorkOrderApi } from './work-order-api';

type Step = 'accept' | 'decline' | 'schedule' | 'arrive' | 'complete';

/** What the contractor can do next, in the order of the job (the server's state machine). */
const NEXT_STEPS: Readonly<Record<WorkOrderState, readonly Step[]>> = {
  dispatched: ['accept', 'decline'],
  accepted: ['schedule', 'arrive'],
  scheduled: ['schedule', 'arrive'],
  reopened: ['schedule', 'arrive'],
  'on-site': ['complete'],
  completed: [],
  verified: [],
  declined: [],
  cancelled: [],
};

const HOUR_MS = 3_600_000;

/** The contractor's next steps on the job: accept or decline, schedule the visit, on site, complete. */
@Component({
  selector: 'cw-job-actions',
  imports: [MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './job-actions.html',
  styleUrl: './job-actions.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobActions {
  private readonly api = inject(WorkOrderApi);
  private readonly dialog = inject(MatDialog);

  readonly job = input.required<WorkOrderView>();
  readonly changed = output<WorkOrderView>();

  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly scheduling = signal(false);
  protected readonly steps = computed(() => NEXT_STEPS[this.job().state]);
  protected readonly visitForm = new FormGroup({
    start: new FormControl('', { nonNullable: true, validators: Validators.required }),
    end: new FormControl('', { nonNullable: true, validators: Validators.required }),
  });

  protected has(step: Step): boolean {
    return this.steps().includes(step);
  }

  protected accept(): void {
    this.run(this.api.accept(this.job().id));
  }

  protected decline(): void {
    this.dialog
      .open<DeclineDialog, void, string>(DeclineDialog, { width: '480px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((reason): reason is string => !!reason))
      .subscribe((reason) => this.run(this.api.decline(this.job().id, reason)));
  }

  /** Opens the visit form, starting from the tenant's first access window still ahead, else the next hour. */
  protected openSchedule(): void {
    const job = this.job();
    const zone = job.property.timeZone;
    const nowMs = Date.now();
    const window = job.accessWindows.find((w) => Date.parse(w.to) > nowMs);
    const startMs = job.scheduledStartAt ? Date.parse(job.scheduledStartAt) : window ? Math.max(Date.parse(window.from), nowMs) : Math.ceil(nowMs / HOUR_MS) * HOUR_MS;
    const endMs = job.scheduledEndAt ? Date.parse(job.scheduledEndAt) : window ? Date.parse(window.to) : startMs + 2 * HOUR_MS;
    this.visitForm.setValue({ start: isoToWallTime(startMs, zone), end: isoToWallTime(endMs, zone) });
    this.error.set(null);
    this.scheduling.set(true);
  }

  protected saveSchedule(): void {
    const zone = this.job().property.timeZone;
    const startAt = wallTimeToIso(this.visitForm.controls.start.value, zone);
    const endAt = wallTimeToIso(this.visitForm.controls.end.value, zone);
    if (!startAt || !endAt) {
      this.error.set('Give the visit a start and an end.');
      return;
    }
    if (Date.parse(endAt) <= Date.parse(startAt)) {
      this.error.set('The visit must end after it starts.');
      return;
    }
    this.run(this.api.schedule(this.job().id, { startAt, endAt }), () => this.scheduling.set(false));
  }

  protected arrive(): void {
    this.run(this.api.arrive(this.job().id));
  }

  protected complete(): void {
    const job = this.job();
    const data: CompleteDialogData = { suspectedCause: job.diagnosis.topCause, findings: job.findings, notes: job.notes };
    this.dialog
      .open<CompleteDialog, CompleteDialogData, CompleteRequest>(CompleteDialog, { data, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(
        filter((report): report is CompleteRequest => !!report),
        switchMap((report) => {
          this.busy.set(true);
          return this.api.complete(job.id, report);
        }),
      )
      .subscribe({ next: (view) => this.done(view), error: (error: ApiError) => this.failed(error) });
  }

  private run(call: Observable<WorkOrderView>, after?: () => void): void {
    this.busy.set(true);
    this.error.set(null);
    call.subscribe({
      next: (view) => {
        after?.();
        this.done(view);
      },
      error: (error: ApiError) => this.failed(error),
    });
  }

  private done(view: WorkOrderView): void {
    this.busy.set(false);
    this.error.set(null);
    this.changed.emit(view);
  }

  private failed(error: ApiError): void {
    this.busy.set(false);
    this.error.set(error.message);
  }
}
