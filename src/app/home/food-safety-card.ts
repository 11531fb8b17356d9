import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { FoodSafetyGuidance } from '../../../shared/api/tenant';
import type { TemperatureUnit } from '../../../shared/temperature';
import { durationWords } from './home-words';

/**
 * What to do with the food while the fridge is warm, as the server words it after USDA FSIS
 * guidance, with its sources named and the local health authority given the last word.
 */
@Component({
  selector: 'cw-food-safety-card',
  imports: [MatCardModule, MatIconModule],
  templateUrl: './food-safety-card.html',
  styleUrl: './food-safety-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FoodSafetyCard {
  readonly guidance = input.required<FoodSafetyGuidance>();
  readonly unit = input<TemperatureUnit>('F');

  /** 40 °F is the FDA's fresh-food limit; the FDA page rounds it to 4 °C. */
  protected readonly limit = computed(() => (this.unit() === 'F' ? '40 °F' : '4 °C'));
  protected readonly timeAbove = computed(() => durationWords(this.guidance().minutesAbove4c));
  protected readonly pastTwoHours = computed(() => this.guidance().minutesAbove4c > 120);
}
