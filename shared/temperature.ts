/**
 * Temperature facts and conversions. The conversion is exact: °F = °C × 9/5 + 32
 * (NIST SP 811, Appendix B.8).
 */

export function cToF(tempC: number): number {
  return (tempC * 9) / 5 + 32;
}

export function fToC(tempF: number): number {
  return ((tempF - 32) * 5) / 9;
}

/** Fresh food at or below 40 °F (U.S. FDA, "Refrigerator Thermometers: Cold Facts about Food Safety"). */
export const FRESH_FOOD_LIMIT_C = fToC(40);

/** Freezer at or below 0 °F (U.S. FDA, same page). */
export const FREEZER_LIMIT_C = fToC(0);

/** Perishables above 40 °F for more than 2 hours are discarded (USDA FSIS, "Danger Zone"). */
export const DANGER_ZONE_DISCARD_MINUTES = 120;

/** Above 90 °F the 2-hour rule becomes 1 hour (USDA FSIS, "Danger Zone"). */
export const HOT_ROOM_C = fToC(90);
export const HOT_ROOM_DISCARD_MINUTES = 60;

/** A closed refrigerator keeps food safe about 4 hours without power (USDA FSIS, "Keeping Food Safe During an Emergency"). */
export const CLOSED_FRIDGE_SAFE_HOURS = 4;

/** A full freezer holds about 48 hours closed, a half-full one about 24 (USDA FSIS, same page). */
export const FULL_FREEZER_SAFE_HOURS = 48;
export const HALF_FREEZER_SAFE_HOURS = 24;

export type TemperatureUnit = 'C' | 'F';

export function formatTemperature(tempC: number | null | undefined, unit: TemperatureUnit, digits = 1): string {
  if (tempC === null || tempC === undefined || !Number.isFinite(tempC)) return '—';
  const value = unit === 'F' ? cToF(tempC) : tempC;
  return `${value.toFixed(digits)} °${unit}`;
}
