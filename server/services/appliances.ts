import type { DataSource } from 'typeorm';
import {
  DEFAULT_REPAIR_RULE,
  INCIDENT_HISTORY_LIMIT,
  type ApplianceDetail,
  type ApplianceForecast,
  type ApplianceLife,
  type IncidentWithFindings,
  type LearnedNormalView,
  type RepairRuleSettings,
  type ServiceHistoryEntry,
} from '../../shared/api/appliances';
import { EXPECTED_SERVICE_LIFE_YEARS, SERVICE_LIFE_SOURCE, ageYears, lifeClassOf } from '../../shared/api/fleet-constants';
import type { ApplianceStyle, Probe } from '../../shared/domain';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../shared/temperature';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import type { Scope } from '../auth/scope';
import { DetectionEngine } from '../detection/engine';
import type { EngineState } from '../detection/state';
import { forbidden, notFound } from '../errors';
import { probeLevels } from '../monitor/engine-levels';
import { applianceRow, incidentsOf, sensorsOf, type ApplianceRow } from './appliance-queries';
import { repairOrReplace } from './repair-rule';

/** Work orders of an appliance, from the work-order loop; null while it records none. */
export interface ServiceHistorySource {
  forAppliance(applianceId: string): Promise<ServiceHistoryEntry[] | null>;
}

/** The organization's repair-or-replace setting. */
export interface RepairRuleSource {
  forOrganization(organizationId: string): Promise<RepairRuleSettings>;
}

export const NO_SERVICE_HISTORY: ServiceHistorySource = { forAppliance: async () => null };
export const DEFAULT_REPAIR_RULE_SOURCE: RepairRuleSource = { forOrganization: async () => DEFAULT_REPAIR_RULE };

export interface AppliancesServiceDeps {
  dataSource: DataSource;
  scope: Scope;
  clock: Clock;
  serviceHistory?: ServiceHistorySource;
  repairRule?: RepairRuleSource;
}

const LIMIT_C: Record<Probe, number> = { fresh_food: FRESH_FOOD_LIMIT_C, freezer: FREEZER_LIMIT_C };

function lifeOf(style: ApplianceStyle, installedOn: string | null, nowMs: number): ApplianceLife {
  const lifeClass = lifeClassOf(style);
  const expectedYears = EXPECTED_SERVICE_LIFE_YEARS[lifeClass];
  const age = ageYears(installedOn, nowMs);
  return { lifeClass, expectedYears, ageYears: age, lifeFraction: age === null ? null : Math.round((age / expectedYears) * 100) / 100, source: SERVICE_LIFE_SOURCE };
}

/** What the engine learned; null before it has state, or for a state of an older engine version. */
function normalOf(style: ApplianceStyle, state: EngineState | null): LearnedNormalView | null {
  if (!state) return null;
  try {
    const learned = new DetectionEngine(style, undefined, state).learned();
    const levels = probeLevels(state);
    const probes: LearnedNormalView['probes'] = {};
    for (const probe of Object.keys(levels) as Probe[]) {
      probes[probe] = { baselineC: learned.baselineC[probe], spreadC: learned.spreadC[probe], levelC: levels[probe]?.levelC ?? null };
    }
    return {
      ready: learned.ready,
      probes,
      cyclePeriodMinutes: learned.cyclePeriodMinutes,
      defrostIntervalHours: learned.defrostIntervalHours,
      defrostDurationMinutes: learned.defrostDurationMinutes,
      doorOpeningsPerDay: learned.doorOpeningsPerDay,
    };
  } catch {
    return null;
  }
}

function defrostsOf(style: ApplianceStyle, state: EngineState | null): ApplianceDetail['defrosts'] {
  const probe: Probe = style === 'fresh-food-only' ? 'fresh_food' : 'freezer';
  return (state?.defrosts ?? []).map((defrost) => ({ at: new Date(defrost.atMs).toISOString(), probe }));
}

/** The open warming trend's forecast, drawn from the latest reading to the limit it will cross. */
function forecastOf(incident: IncidentWithFindings | null, row: ApplianceRow): ApplianceForecast | null {
  const trend = incident?.findings.find((f) => f.kind === 'warming-trend' && f.endedAt === null && f.forecastCrossingAt);
  if (!trend?.forecastCrossingAt || !row.last_reading_at) return null;
  const probe: Probe = trend.compartment === 'freezer' ? 'freezer' : 'fresh_food';
  const fromC = probe === 'freezer' ? row.freezer_c : row.fresh_food_c;
  if (fromC === null || fromC >= LIMIT_C[probe] || Date.parse(trend.forecastCrossingAt) <= row.last_reading_at.getTime()) return null;
  return { probe, fromAt: row.last_reading_at.toISOString(), fromC, crossingAt: trend.forecastCrossingAt, limitC: LIMIT_C[probe] };
}

function addressOf(row: ApplianceRow): string {
  return [row.address_line1, row.address_line2, [row.city, row.region, row.postal_code].filter(Boolean).join(' ')].filter(Boolean).join(', ');
}

/** One appliance for the manager's appliance page. Scope: the manager's organization (404 outside it). */
export class AppliancesService {
  private readonly serviceHistory: ServiceHistorySource;
  private readonly repairRule: RepairRuleSource;

  constructor(private readonly deps: AppliancesServiceDeps) {
    this.serviceHistory = deps.serviceHistory ?? NO_SERVICE_HISTORY;
    this.repairRule = deps.repairRule ?? DEFAULT_REPAIR_RULE_SOURCE;
  }

  async detail(actor: Actor, applianceId: string): Promise<ApplianceDetail> {
    if (actor.role !== 'manager') throw forbidden('only managers see the appliance page');
    await this.deps.scope.requireAppliance(actor, applianceId);
    const row = await applianceRow(this.deps.dataSource, applianceId);
    if (!row) throw notFound('appliance');
    const nowMs = this.deps.clock.now().getTime();
    const style = row.style as ApplianceStyle;
    const [sensors, incidents, history, rule] = await Promise.all([
      sensorsOf(this.deps.dataSource, applianceId),
      incidentsOf(this.deps.dataSource, applianceId, INCIDENT_HISTORY_LIMIT),
      this.serviceHistory.forAppliance(applianceId),
      this.repairRule.forOrganization(row.organization_id),
    ]);
    const life = lifeOf(style, row.installed_on, nowMs);
    const openIncident = incidents.find((incident) => incident.closedAt === null && incident.lane === 'repair') ?? incidents.find((incident) => incident.closedAt === null) ?? null;
    return {
      id: row.id,
      style,
      model: row.model,
      serial: row.serial,
      installedOn: row.installed_on,
      warrantyEndsOn: row.warranty_ends_on,
      underWarranty: row.warranty_ends_on ? Date.parse(`${row.warranty_ends_on}T23:59:59Z`) >= nowMs : null,
      archivedAt: row.archived_at?.toISOString() ?? null,
      place: { organizationId: row.organization_id, propertyId: row.property_id, propertyName: row.property_name, address: addressOf(row), timeZone: row.time_zone, unitId: row.unit_id, unitLabel: row.unit_label },
      sensors,
      life,
      repairOrReplace: repairOrReplace(life, rule, history, nowMs),
      now: { health: row.health ?? 'silent', since: row.health_since?.toISOString() ?? null, lastReadingAt: row.last_reading_at?.toISOString() ?? null, freshFoodC: row.fresh_food_c, freezerC: row.freezer_c },
      normal: normalOf(style, row.engine_state),
      defrosts: defrostsOf(style, row.engine_state),
      openIncident,
      forecast: forecastOf(openIncident, row),
      incidents,
      serviceHistory: history,
    };
  }
}
