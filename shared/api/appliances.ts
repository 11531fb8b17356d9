/**
 * `GET /api/appliances/:id`: one appliance as the manager's appliance page shows it —
 * details, age against its expected life, the repair-or-replace rule of thumb, current
 * health, learned normal, the diagnosis of the open incident, the incident timeline and
 * the service history.
 */
import { z } from 'zod';
import type { ApplianceStyle, CauseCode, Compartment, FindingKind, Health, Probe, Severity } from '../domain';
import type { LifeClass } from './fleet-constants';
import type { IncidentView } from './monitor';

export const ApplianceIdParams = z.object({ id: z.uuid('not an appliance id') });

export interface AppliancePlace {
  organizationId: string;
  propertyId: string;
  propertyName: string;
  address: string;
  /** IANA time zone: the page shows the appliance's dates in it. */
  timeZone: string;
  unitId: string;
  unitLabel: string;
}

export interface ApplianceSensorView {
  /** For the link to the sensor's page (Inventory → Sensors). */
  id: string;
  deviceId: string;
  intervalSeconds: number;
  lastSeenAt: string | null;
}

export interface ApplianceLife {
  lifeClass: LifeClass;
  expectedYears: number;
  ageYears: number | null;
  /** Age ÷ expected life; null when the install date is unknown. */
  lifeFraction: number | null;
  source: string;
}

/**
 * The repair-or-replace rule of thumb (common practice, a setting): past the given share of
 * its expected life, replace when a repair costs at least the given share of a new unit.
 */
export interface RepairRuleSettings {
  /** Replace when the repair costs this share of a new unit or more (0.5 = half). */
  repairShareOfNewPrice: number;
  /** …once the appliance is past this share of its expected life (0.5 = mid-life). */
  pastLifeShare: number;
  /** Price of a comparable new unit per life class, in cents; null when not configured. */
  newUnitPriceCents: Partial<Record<LifeClass, number>>;
  currency: string;
}

/** The setting as stored under `repairOrReplace` in the organization's settings. */
export const RepairRuleSchema = z.object({
  repairShareOfNewPrice: z.number().min(0.05).max(1),
  pastLifeShare: z.number().min(0).max(2),
  newUnitPriceCents: z.partialRecord(z.enum(['refrigerator', 'freezer', 'compact-refrigerator']), z.number().int().min(0).max(10_000_000)),
  currency: z.string().regex(/^[A-Z]{3}$/),
});

export const DEFAULT_REPAIR_RULE: RepairRuleSettings = {
  repairShareOfNewPrice: 0.5,
  pastLifeShare: 0.5,
  newUnitPriceCents: {},
  currency: 'USD',
};

/** `repair`: young enough to repair; `weigh`: past the threshold, compare the quote; `replace`: the rule says replace. */
export type RepairVerdict = 'repair' | 'weigh' | 'replace' | 'unknown';

export interface RepairOrReplaceHint {
  verdict: RepairVerdict;
  /** One plain sentence. */
  summary: string;
  /** The repair cost at or above which the rule says replace, when a new-unit price is set. */
  replaceAtCents: number | null;
  /** Repairs on the service history over the last 12 months. */
  repairsLastYearCents: number;
  currency: string;
  rule: RepairRuleSettings;
}

export interface ApplianceHealthNow {
  health: Health;
  since: string | null;
  lastReadingAt: string | null;
  freshFoodC: number | null;
  freezerC: number | null;
}

/** What the detection engine has learned of this appliance's own rhythm. */
export interface LearnedNormalView {
  ready: boolean;
  probes: Partial<Record<Probe, { baselineC: number | null; spreadC: number | null; levelC: number | null }>>;
  cyclePeriodMinutes: number | null;
  defrostIntervalHours: number | null;
  defrostDurationMinutes: number | null;
  doorOpeningsPerDay: number | null;
}

export interface FindingView {
  id: string;
  kind: FindingKind;
  compartment: Compartment;
  startedAt: string;
  detectedAt: string;
  endedAt: string | null;
  severity: Severity;
  summary: string;
  forecastCrossingAt: string | null;
}

export interface IncidentWithFindings extends IncidentView {
  findings: FindingView[];
}

/** A warming trend's forecast: where the probe is now and when it is expected to cross its limit. */
export interface ApplianceForecast {
  probe: Probe;
  fromAt: string;
  fromC: number;
  crossingAt: string;
  limitC: number;
}

export interface ServicePartView {
  name: string;
  quantity: number;
  unitCostCents: number;
}

/** One work order on this appliance, as the service history lists it. */
export interface ServiceHistoryEntry {
  workOrderId: string;
  state: string;
  contractorName: string;
  dispatchedAt: string;
  completedAt: string | null;
  causeFound: CauseCode | 'other' | null;
  findings: string;
  parts: ServicePartView[];
  labourMinutes: number;
  totalCents: number;
  currency: string;
}

export interface ApplianceDetail {
  id: string;
  style: ApplianceStyle;
  model: string;
  serial: string;
  installedOn: string | null;
  warrantyEndsOn: string | null;
  underWarranty: boolean | null;
  archivedAt: string | null;
  place: AppliancePlace;
  sensors: ApplianceSensorView[];
  life: ApplianceLife;
  repairOrReplace: RepairOrReplaceHint;
  now: ApplianceHealthNow;
  normal: LearnedNormalView | null;
  /** Recent automatic defrosts the engine recognised (start of each rise). */
  defrosts: { at: string; probe: Probe }[];
  /** The open repair incident (its causes are the diagnosis), else null. */
  openIncident: IncidentWithFindings | null;
  forecast: ApplianceForecast | null;
  /** Most recent first, at most INCIDENT_HISTORY_LIMIT. */
  incidents: IncidentWithFindings[];
  /** Null when work orders are not recorded for this organization yet. */
  serviceHistory: ServiceHistoryEntry[] | null;
}

export const INCIDENT_HISTORY_LIMIT = 20;
