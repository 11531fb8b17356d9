import type { ApplianceStyle } from '../../../shared/domain';
import { APPLIANCE_STYLES } from '../../../shared/domain';

export const STYLE_LABELS: Record<ApplianceStyle, string> = {
  'top-freezer': 'Top freezer',
  'bottom-freezer': 'Bottom freezer',
  'side-by-side': 'Side by side',
  'fresh-food-only': 'Fresh food only',
  'upright-freezer': 'Upright freezer',
  'chest-freezer': 'Chest freezer',
};

export const STYLE_CHOICES = APPLIANCE_STYLES.map((style) => ({ value: style, label: STYLE_LABELS[style] }));

/** "Cedar Row · 4B": where an appliance or sensor stands. */
export function placeLabel(propertyName: string, unitLabel: string): string {
  return `${propertyName} · ${unitLabel}`;
}

/** "every 5 min", "every 30 s". */
export function intervalLabel(seconds: number): string {
  if (seconds % 60 === 0) return `every ${seconds / 60} min`;
  return `every ${seconds} s`;
}

/** "1 property", "3 properties". */
export function countOf(count: number, singular: string, plural = `${singular}s`): string {
  return `${count.toLocaleString()} ${count === 1 ? singular : plural}`;
}

/** "2 properties, 3 units and 5 appliances". */
export function inventoryCounts(counts: { properties: number; units: number; appliances: number }): string {
  return `${countOf(counts.properties, 'property', 'properties')}, ${countOf(counts.units, 'unit')} and ${countOf(counts.appliances, 'appliance')}`;
}
