import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import type { FleetAppliance } from '../../../shared/api/fleet';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C, formatTemperature, type TemperatureUnit } from '../../../shared/temperature';
import { HEALTH_ICONS, HEALTH_LABELS, KIND_LABELS, STYLE_LABELS, STYLE_SHORT, healthColor } from './appliance-words';
import type { TileUnit } from './fleet-layout';
import { formatZoned } from './zoned-date';

/**
 * The temperature a tile shows: the fresh-food section's, unless the appliance is warm or
 * not cooling and only its freezer is past the food-safety limit (FDA: 40 °F fresh food,
 * 0 °F freezer); the freezer's when there is no fresh-food section. A healthy freezer
 * briefly above 0 °F (a door, a defrost) keeps the fresh-food figure.
 */
export function headlineTempC(appliance: FleetAppliance): number | null {
  const { freshFoodC, freezerC } = appliance;
  const inTrouble = appliance.health === 'warm' || appliance.health === 'no-cooling';
  const freezerOff = inTrouble && freezerC !== null && freezerC > FREEZER_LIMIT_C;
  const freshOff = freshFoodC !== null && freshFoodC > FRESH_FOOD_LIMIT_C;
  if (freezerOff && !freshOff) return freezerC;
  return freshFoodC ?? freezerC;
}

/** One unit of a property band: a tile per unit, a link per appliance, coloured by health. */
@Component({
  selector: 'cw-unit-tile',
  imports: [MatIconModule, MatTooltipModule, RouterLink],
  templateUrl: './unit-tile.html',
  styleUrl: './unit-tile.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnitTile {
  readonly tile = input.required<TileUnit>();
  readonly unit = input<TemperatureUnit>('F');
  readonly timeZone = input<string | null>(null);
  /** Appliances that changed on the live feed a moment ago. */
  readonly changed = input<ReadonlySet<string>>(new Set());

  protected readonly healthIcons = HEALTH_ICONS;
  protected readonly styleShort = STYLE_SHORT;
  protected readonly healthColor = healthColor;
  protected readonly several = computed(() => this.tile().unit.appliances.length > 1);

  protected temperature(appliance: FleetAppliance): string {
    return formatTemperature(headlineTempC(appliance), this.unit(), 0).replace(' ', '');
  }

  protected describe(appliance: FleetAppliance): string {
    const parts = [
      `Unit ${this.tile().unit.label}`,
      STYLE_LABELS[appliance.style],
      HEALTH_LABELS[appliance.health],
    ];
    if (appliance.freshFoodC !== null) parts.push(`fresh food ${formatTemperature(appliance.freshFoodC, this.unit())}`);
    if (appliance.freezerC !== null) parts.push(`freezer ${formatTemperature(appliance.freezerC, this.unit())}`);
    if (appliance.openIncident) parts.push(`open incident: ${KIND_LABELS[appliance.openIncident.kind]}, ${appliance.openIncident.severity}`);
    if (appliance.pastExpectedLife) parts.push('past its expected life');
    return parts.join(', ');
  }

  protected tooltip(appliance: FleetAppliance): string {
    const since = appliance.healthSince ? ` since ${formatZoned(appliance.healthSince, this.timeZone(), 'short')}` : '';
    const age = appliance.ageYears === null ? 'age unknown' : `${appliance.ageYears.toFixed(1)} years old`;
    return `${STYLE_LABELS[appliance.style]} · ${HEALTH_LABELS[appliance.health]}${since} · ${age}`;
  }
}
