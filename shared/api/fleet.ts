/**
 * `GET /api/fleet`: the manager's fleet overview, aggregated on the server. Every property
 * of the organization as a band of its units, each unit with its appliances' current health.
 */
import { z } from 'zod';
import { APPLIANCE_STYLES, HEALTH_STATES, type ApplianceStyle, type CauseCode, type FindingKind, type Health, type Severity } from '../domain';
import { AGE_BANDS, type AgeBand, type HealthCounts } from './fleet-constants';

export type { HealthCounts } from './fleet-constants';

/** A list parameter: `?health=warm,no-cooling` or `?health=warm&health=no-cooling`. */
function listOf<T extends z.ZodType>(item: T) {
  return z.preprocess((value) => {
    if (value === undefined || value === '') return undefined;
    const parts = (Array.isArray(value) ? value : [value]).flatMap((part) => String(part).split(','));
    return parts.map((part) => part.trim()).filter(Boolean);
  }, z.array(item).max(50).optional());
}

export const FleetQuery = z
  .object({
    property: listOf(z.uuid('not a property id')),
    health: listOf(z.enum(HEALTH_STATES)),
    style: listOf(z.enum(APPLIANCE_STYLES)),
    age: z.enum(AGE_BANDS).optional(),
    /** Part of a unit label or a sensor's device id. */
    q: z.string().trim().max(100).optional(),
  })
  .strict();
export type FleetQuery = z.infer<typeof FleetQuery>;

/** What the client sends (all optional). */
export interface FleetFilters {
  property?: string[];
  health?: Health[];
  style?: ApplianceStyle[];
  age?: AgeBand;
  q?: string;
}

/** The worst open incident of an appliance, enough for a tile. */
export interface FleetIncidentSummary {
  id: string;
  kind: FindingKind;
  severity: Severity;
  topCause: CauseCode | null;
  openedAt: string;
  /** Open incidents on this appliance, this one included. */
  openCount: number;
}

/** One tile: kept small, since a fleet of thousands arrives in one answer. */
export interface FleetAppliance {
  id: string;
  style: ApplianceStyle;
  health: Health;
  healthSince: string | null;
  /** Latest temperatures, rounded to 0.1 °C. */
  freshFoodC: number | null;
  freezerC: number | null;
  ageYears: number | null;
  /** Older than the expected service life of its style. */
  pastExpectedLife: boolean;
  openIncident: FleetIncidentSummary | null;
}

export interface FleetUnit {
  id: string;
  label: string;
  floor: number | null;
  appliances: FleetAppliance[];
}

export interface FleetProperty {
  id: string;
  name: string;
  city: string;
  timeZone: string;
  /** Per health word, over this property's appliances shown (every filter applied). */
  counts: HealthCounts;
  /** Open property-level incidents (a power loss), whatever the filters. */
  propertyIncidents: { id: string; kind: FindingKind; severity: Severity; openedAt: string }[];
  units: FleetUnit[];
}

export interface FleetOverview {
  generatedAt: string;
  /**
   * Per health word, over the appliances that match every filter except health, so the
   * health filter's choices show how many each would add.
   */
  counts: HealthCounts;
  /** Appliances shown (every filter applied). */
  total: number;
  properties: FleetProperty[];
  /** Every active property of the organization, for the property filter. */
  propertyOptions: { id: string; name: string }[];
}
