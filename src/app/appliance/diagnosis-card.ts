import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { IncidentWithFindings } from '../../../shared/api/appliances';
import { SAFETY_CAUTIONS } from '../../../shared/causes';
import type { CauseCode } from '../../../shared/domain';
import { KIND_LABELS, SEVERITY_LABELS } from '../fleet/appliance-words';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { rankCauses, type RankedCause } from '../shared/rank-causes';

/** The open incident's probable causes with their confidence, and for the chosen one what to bring, check and watch out for. */
@Component({
  selector: 'cw-diagnosis-card',
  imports: [MatButtonModule, MatCardModule, MatIconModule, MatProgressBarModule, ZonedDatePipe],
  templateUrl: './diagnosis-card.html',
  styleUrl: './diagnosis-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiagnosisCard {
  readonly incident = input<IncidentWithFindings | null>(null);
  readonly timeZone = input<string | null>(null);

  protected readonly cautions = SAFETY_CAUTIONS;
  protected readonly kindLabels = KIND_LABELS;
  protected readonly severityLabels = SEVERITY_LABELS;
  private readonly picked = signal<CauseCode | null>(null);

  protected readonly causes = computed(() => rankCauses(this.incident()?.probableCauses ?? []));

  /** The cause whose repair content is shown: the one picked, else the most likely. */
  protected readonly shown = computed<RankedCause | null>(() => this.causes().find((c) => c.code === this.picked()) ?? this.causes().at(0) ?? null);

  protected pick(code: CauseCode): void {
    this.picked.set(code);
  }
}
