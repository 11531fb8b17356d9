import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { DiagnosisView } from '../../../shared/api/work-orders';
import type { CauseCode } from '../../../shared/domain';
import { KIND_LABELS, SEVERITY_LABELS } from '../fleet/appliance-words';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { rankCauses, type RankedCause } from '../shared/rank-causes';

/** The engine's probable causes with their confidence; for the chosen one, the parts to bring and the checks to make. */
@Component({
  selector: 'cw-job-diagnosis',
  imports: [MatCardModule, MatIconModule, ZonedDatePipe],
  templateUrl: './job-diagnosis.html',
  styleUrl: './job-diagnosis.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobDiagnosis {
  readonly diagnosis = input.required<DiagnosisView>();
  readonly timeZone = input<string | null>(null);

  protected readonly kindLabels = KIND_LABELS;
  protected readonly severityLabels = SEVERITY_LABELS;
  private readonly picked = signal<CauseCode | null>(null);

  protected readonly causes = computed(() => rankCauses(this.diagnosis().incident?.probableCauses ?? []));

  /** The cause whose repair content is shown: the one tapped, else the most likely (or the request's own when no incident ranks any). */
  protected readonly shown = computed<RankedCause | null>(() => {
    const ranked = this.causes().find((c) => c.code === this.picked()) ?? this.causes().at(0);
    if (ranked) return ranked;
    const cause = this.diagnosis().cause;
    return cause ? { code: cause.code, confidence: 0, percent: 0, info: cause } : null;
  });

  protected pick(code: CauseCode): void {
    this.picked.set(code);
  }
}
