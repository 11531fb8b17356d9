import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { ApplianceDetail, RepairVerdict } from '../../../shared/api/appliances';
import type { Probe } from '../../../shared/domain';
import { formatTemperature, type TemperatureUnit } from '../../../shared/temperature';
import { PROBE_LABELS, STYLE_LABELS } from '../fleet/appliance-words';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { formatMoney } from './money';
import { RouterLink } from '@angular/router';

const VERDICT_WORDS: Record<RepairVerdict, string> = {
  repair: 'Repair',
  weigh: 'Compare the quote',
  replace: 'Replace',
  unknown: 'Not enough to go on',
};

/** Temperature differences convert without the 32 °F offset. */
function formatSpread(spreadC: number | null, unit: TemperatureUnit): string {
  if (spreadC === null) return '';
  const value = unit === 'F' ? (spreadC * 9) / 5 : spreadC;
  return ` ± ${value.toFixed(1)} °${unit}`;
}

/** The appliance's particulars, its age against its expected life, the repair-or-replace rule of thumb and its learned normal. */
@Component({
  selector: 'cw-appliance-facts',
  imports: [DecimalPipe, MatCardModule, MatIconModule, RouterLink, ZonedDatePipe],
  templateUrl: './appliance-facts.html',
  styleUrl: './appliance-facts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApplianceFacts {
  readonly detail = input.required<ApplianceDetail>();
  readonly unit = input<TemperatureUnit>('F');

  protected readonly styleLabels = STYLE_LABELS;
  protected readonly verdictWords = VERDICT_WORDS;

  /** The age bar's scale: the expected life, or the age when older. */
  protected readonly ageScale = computed(() => {
    const { life, repairOrReplace } = this.detail();
    const scaleYears = Math.max(life.expectedYears, life.ageYears ?? 0) * 1.05;
    const percent = (years: number) => Math.min(100, (years / scaleYears) * 100);
    return {
      agePercent: life.ageYears === null ? 0 : percent(life.ageYears),
      midPercent: percent(life.expectedYears * repairOrReplace.rule.pastLifeShare),
      endPercent: percent(life.expectedYears),
      stage: life.lifeFraction === null ? 'unknown' : life.lifeFraction >= 1 ? 'past' : life.lifeFraction >= repairOrReplace.rule.pastLifeShare ? 'late' : 'early',
    };
  });

  protected readonly normalRows = computed(() => {
    const normal = this.detail().normal;
    if (!normal) return [];
    return (Object.keys(normal.probes) as Probe[]).map((probe) => {
      const p = normal.probes[probe]!;
      return { probe, label: PROBE_LABELS[probe], text: p.baselineC === null ? 'still learning' : `${formatTemperature(p.baselineC, this.unit())}${formatSpread(p.spreadC, this.unit())}` };
    });
  });

  protected readonly ruleWords = computed(() => {
    const { rule } = this.detail().repairOrReplace;
    return `past ${Math.round(rule.pastLifeShare * 100)} % of the expected life, replace when a repair costs ${Math.round(rule.repairShareOfNewPrice * 100)} % of a new unit or more`;
  });

  protected money(cents: number): string {
    return formatMoney(cents, this.detail().repairOrReplace.currency);
  }
}
