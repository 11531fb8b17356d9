import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { TenantApplianceView } from '../../../shared/api/tenant';
import { formatTemperature, type TemperatureUnit } from '../../../shared/temperature';
import { HEALTH_ICONS, HEALTH_LABELS, STYLE_LABELS, healthColor } from '../fleet/appliance-words';
import { formatZoned } from '../fleet/zoned-date';
import { agoWords, hasFreezer, hasFreshFood } from './home-words';

interface Reading {
  label: string;
  text: string;
}

/** One appliance of the unit: its health word on the thermal scale, temperatures, when last heard from. */
@Component({
  selector: 'cw-appliance-status',
  imports: [MatCardModule, MatIconModule],
  templateUrl: './appliance-status.html',
  styleUrl: './appliance-status.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApplianceStatus {
  readonly appliance = input.required<TenantApplianceView>();
  readonly unit = input<TemperatureUnit>('F');
  readonly timeZone = input<string | null>(null);
  /** The time "last heard from" is counted from; the page passes it when it loads. */
  readonly nowMs = input(Date.now());

  protected readonly name = computed(() => STYLE_LABELS[this.appliance().style]);
  protected readonly word = computed(() => HEALTH_LABELS[this.appliance().health]);
  protected readonly icon = computed(() => HEALTH_ICONS[this.appliance().health]);
  protected readonly colour = computed(() => healthColor(this.appliance().health));
  protected readonly readings = computed<Reading[]>(() => {
    const appliance = this.appliance();
    const readings: Reading[] = [];
    if (hasFreshFood(appliance.style)) readings.push({ label: 'Fridge', text: formatTemperature(appliance.freshFoodC, this.unit()) });
    if (hasFreezer(appliance.style)) readings.push({ label: 'Freezer', text: formatTemperature(appliance.freezerC, this.unit()) });
    return readings;
  });
  protected readonly lastHeard = computed(() => {
    const at = this.appliance().lastReadingAt;
    if (!at) return 'The sensor has not reported yet.';
    return `Last heard from ${agoWords(at, this.nowMs())} (${formatZoned(at, this.timeZone(), 'short')}).`;
  });
}
