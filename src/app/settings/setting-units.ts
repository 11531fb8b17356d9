import type { DetectionSettingField } from '../../../shared/api/settings';
import { cToF, fToC, type TemperatureUnit } from '../../../shared/temperature';

/** A setting's value as the person reads it: °F or °C for temperatures, minutes otherwise. */
export function toDisplay(field: Pick<DetectionSettingField, 'kind'>, valueC: number, unit: TemperatureUnit): number {
  if (field.kind === 'minutes' || unit === 'C') return field.kind === 'minutes' ? valueC : round1(valueC);
  // A difference of temperatures has no 32° offset (NIST SP 811, B.8: Δ°F = Δ°C × 9/5).
  return round1(field.kind === 'temperature' ? cToF(valueC) : (valueC * 9) / 5);
}

/** Back to what the server stores (°C or minutes). */
export function fromDisplay(field: Pick<DetectionSettingField, 'kind'>, value: number, unit: TemperatureUnit): number {
  if (field.kind === 'minutes' || unit === 'C') return value;
  return field.kind === 'temperature' ? fToC(value) : (value * 5) / 9;
}

export function unitSuffix(field: Pick<DetectionSettingField, 'kind'>, unit: TemperatureUnit): string {
  return field.kind === 'minutes' ? 'min' : `°${unit}`;
}

/**
 * Bounds in display units, rounded inwards to the shown precision so a value the form
 * accepts is never outside the server's bounds (40.0 °F stays 40.0, not 40.04).
 */
export function displayBounds(field: DetectionSettingField, unit: TemperatureUnit): { min: number; max: number } {
  const low = toDisplayExact(field, field.min, unit);
  const high = toDisplayExact(field, field.max, unit);
  if (field.kind === 'minutes') return { min: low, max: high };
  return { min: Math.ceil(low * 10 - 1e-9) / 10, max: Math.floor(high * 10 + 1e-9) / 10 };
}

function toDisplayExact(field: Pick<DetectionSettingField, 'kind'>, valueC: number, unit: TemperatureUnit): number {
  if (field.kind === 'minutes' || unit === 'C') return valueC;
  return field.kind === 'temperature' ? cToF(valueC) : (valueC * 9) / 5;
}

function round1(value: number): number {
  return Math.round(value * 10) / 10;
}
