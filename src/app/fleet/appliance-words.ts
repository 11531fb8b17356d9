/** Words and marks the fleet and appliance pages show for the shared vocabulary. */
import type { ApplianceStyle, CauseCode, FindingKind, Health, Probe, Severity } from '../../../shared/domain';

export const HEALTH_LABELS: Readonly<Record<Health, string>> = {
  cold: 'cold',
  drifting: 'drifting',
  warm: 'warm',
  'no-cooling': 'no cooling',
  silent: 'silent',
};

/** An icon beside every colour, so health never depends on colour alone. */
export const HEALTH_ICONS: Readonly<Record<Health, string>> = {
  cold: 'ac_unit',
  drifting: 'trending_up',
  warm: 'thermostat',
  'no-cooling': 'local_fire_department',
  silent: 'sensors_off',
};

export const HEALTH_MEANINGS: Readonly<Record<Health, string>> = {
  cold: 'holding its normal temperatures',
  drifting: 'warming away from its normal, still food-safe',
  warm: 'above the food-safety limit for longer than the grace period',
  'no-cooling': 'rising toward room temperature',
  silent: 'the sensor is not reporting',
};

export const STYLE_LABELS: Readonly<Record<ApplianceStyle, string>> = {
  'top-freezer': 'Top-freezer refrigerator',
  'bottom-freezer': 'Bottom-freezer refrigerator',
  'side-by-side': 'Side-by-side refrigerator',
  'fresh-food-only': 'Fresh-food-only refrigerator',
  'upright-freezer': 'Upright freezer',
  'chest-freezer': 'Chest freezer',
};

/** One word, for a tile shared by two appliances. */
export const STYLE_SHORT: Readonly<Record<ApplianceStyle, string>> = {
  'top-freezer': 'fridge',
  'bottom-freezer': 'fridge',
  'side-by-side': 'fridge',
  'fresh-food-only': 'fridge',
  'upright-freezer': 'upright',
  'chest-freezer': 'chest',
};

export const KIND_LABELS: Readonly<Record<FindingKind, string>> = {
  'over-temperature': 'over temperature',
  'warming-trend': 'warming trend',
  'no-cooling': 'no cooling',
  'sensor-fault': 'sensor fault',
  'power-loss': 'power loss',
};

export const SEVERITY_LABELS: Readonly<Record<Severity, string>> = { info: 'info', watch: 'watch', urgent: 'urgent', critical: 'critical' };

export const PROBE_LABELS: Readonly<Record<Probe, string>> = { fresh_food: 'Fresh food', freezer: 'Freezer' };

export const CAUSE_FALLBACK: Readonly<Record<CauseCode, string>> = {
  'evaporator-fan': 'evaporator fan',
  'defrost-system': 'defrost system',
  'condenser-airflow': 'condenser airflow',
  'compressor-start': 'compressor start',
  'air-damper': 'air damper',
  'door-seal': 'door seal',
  'power-loss': 'power loss',
  sensor: 'sensor',
};

/** The theme's custom property for a health word (src/theme/_thermal.scss). */
export function healthColor(health: Health): string {
  return `var(--cw-health-${health})`;
}
