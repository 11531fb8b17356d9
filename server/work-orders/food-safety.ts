/**
 * What a tenant should do with their food while the appliance is in trouble, from USDA
 * FSIS guidance, always deferring to the local health authority.
 */
import type { FoodSafetyGuidance } from '../../shared/api/tenant';
import type { Health } from '../../shared/domain';
import {
  CLOSED_FRIDGE_SAFE_HOURS,
  DANGER_ZONE_DISCARD_MINUTES,
  FULL_FREEZER_SAFE_HOURS,
  HALF_FREEZER_SAFE_HOURS,
  HOT_ROOM_DISCARD_MINUTES,
} from '../../shared/temperature';

const SOURCES = [
  'USDA Food Safety and Inspection Service (FSIS): "Keep Your Food Safe During Emergencies", "Refrigeration and Food Safety" and "Danger Zone (40 °F – 140 °F)".',
  'Your local health authority has the final word on food safety.',
];

export const HEALTH_TEXT: Record<Health, string> = {
  cold: 'Cold: it is keeping your food at a safe temperature.',
  drifting: 'Drifting: it is slowly getting warmer than usual, but your food is still cold enough.',
  warm: 'Warm: it is warmer than a safe 40 °F (4 °C) fridge or 0 °F (−18 °C) freezer.',
  'no-cooling': 'Not cooling: it has stopped cooling and is warming toward room temperature.',
  silent: 'No recent readings: the sensor has not reported lately, so we cannot tell how it is doing.',
};

const KEEP_CLOSED =
  `Keep the doors closed as much as you can: a closed refrigerator keeps food safe for about ${CLOSED_FRIDGE_SAFE_HOURS} hours, ` +
  `a full freezer about ${FULL_FREEZER_SAFE_HOURS} hours (about ${HALF_FREEZER_SAFE_HOURS} hours half full).`;
const DISCARD =
  `Throw away perishable food (meat, poultry, fish, milk, soft cheese, eggs, leftovers, cut fruit) that has been above 40 °F (4 °C) ` +
  `for more than ${DANGER_ZONE_DISCARD_MINUTES / 60} hours, or ${HOT_ROOM_DISCARD_MINUTES / 60} hour if the room is above 90 °F (32 °C).`;
// From memory of the USDA FSIS emergency guidance and the FoodSafety.gov refrigerator chart.
const KEEPS = 'Hard cheeses, butter, whole fruit and vegetables and most condiments usually keep. Frozen food that still has ice crystals or is at 40 °F or below can be refrozen.';
// U.S. FDA, "Refrigerator Thermometers: Cold Facts about Food Safety"; USDA FSIS, "Refrigeration and Food Safety".
const THERMOMETER = 'An appliance thermometer tells for sure: the fridge should be at 40 °F (4 °C) or below, the freezer at 0 °F (−18 °C) or below.';
const NEVER_TASTE = 'Never taste food to decide whether it is safe. When in doubt, throw it out.';

function headlineFor(health: Health, minutesAbove4c: number): string {
  if (minutesAbove4c > DANGER_ZONE_DISCARD_MINUTES) {
    return `The fridge has been above 40 °F (4 °C) for ${formatDuration(minutesAbove4c)}: more than 2 hours, so perishable food should be thrown away.`;
  }
  if (minutesAbove4c > 0) {
    return `The fridge has been above 40 °F (4 °C) for ${formatDuration(minutesAbove4c)}. Perishable food is safe for up to 2 hours above 40 °F in total.`;
  }
  if (health === 'no-cooling' || health === 'warm') return 'It is warming up. Keep the doors closed; your food is still cold enough for now.';
  return HEALTH_TEXT[health];
}

export function formatDuration(minutes: number): string {
  const whole = Math.round(minutes);
  if (whole < 60) return `${whole} minute${whole === 1 ? '' : 's'}`;
  const hours = Math.floor(whole / 60);
  const rest = whole % 60;
  return `${hours} hour${hours === 1 ? '' : 's'}${rest ? ` ${rest} minute${rest === 1 ? '' : 's'}` : ''}`;
}

/** Guidance for the tenant's status page and the "warming up" e-mail. */
export function foodSafetyGuidance(health: Health, minutesAbove4c: number): FoodSafetyGuidance {
  const minutes = Math.max(0, Math.round(minutesAbove4c));
  const inTrouble = minutes > 0 || health === 'warm' || health === 'no-cooling';
  const advice = inTrouble ? [KEEP_CLOSED, DISCARD, KEEPS, THERMOMETER, NEVER_TASTE] : [];
  if (health === 'silent') advice.push('If the fridge feels warm, put a thermometer inside and tell your property manager.');
  return { atRisk: minutes > 0, minutesAbove4c: minutes, headline: headlineFor(health, minutes), advice, sources: SOURCES };
}
