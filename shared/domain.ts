/**
 * The product's vocabulary, shared by client and server. The words and codes are the
 * contract of the design brief: change them only together with it.
 */

export const HEALTH_STATES = ['cold', 'drifting', 'warm', 'no-cooling', 'silent'] as const;
export type Health = (typeof HEALTH_STATES)[number];

export const FINDING_KINDS = [
  'over-temperature',
  'warming-trend',
  'no-cooling',
  'sensor-fault',
  'power-loss',
] as const;
export type FindingKind = (typeof FINDING_KINDS)[number];

export const CAUSE_CODES = [
  'evaporator-fan',
  'defrost-system',
  'condenser-airflow',
  'compressor-start',
  'air-damper',
  'door-seal',
  'power-loss',
  'sensor',
] as const;
export type CauseCode = (typeof CAUSE_CODES)[number];

export const PROBES = ['fresh_food', 'freezer'] as const;
export type Probe = (typeof PROBES)[number];

export const COMPARTMENTS = ['fresh_food', 'freezer', 'both'] as const;
export type Compartment = (typeof COMPARTMENTS)[number];

export const APPLIANCE_STYLES = [
  'top-freezer',
  'bottom-freezer',
  'side-by-side',
  'fresh-food-only',
  'upright-freezer',
  'chest-freezer',
] as const;
export type ApplianceStyle = (typeof APPLIANCE_STYLES)[number];

export const ROLES = ['manager', 'contractor', 'tenant'] as const;
export type Role = (typeof ROLES)[number];

export const SEVERITIES = ['info', 'watch', 'urgent', 'critical'] as const;
export type Severity = (typeof SEVERITIES)[number];

/** Whether an appliance style has each probe (a fresh-food-only unit has no freezer). */
export function probesOf(style: ApplianceStyle): readonly Probe[] {
  if (style === 'fresh-food-only') return ['fresh_food'];
  if (style === 'upright-freezer' || style === 'chest-freezer') return ['freezer'];
  return PROBES;
}
