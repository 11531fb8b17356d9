import type { DataSource } from 'typeorm';
import type { FleetAppliance, FleetIncidentSummary, FleetOverview, FleetProperty, FleetQuery, FleetUnit } from '../../shared/api/fleet';
import { ageYears, emptyHealthCounts, expectedLifeYears, type HealthCounts } from '../../shared/api/fleet-constants';
import type { ApplianceStyle, CauseCode, FindingKind, Health, Severity } from '../../shared/domain';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { forbidden } from '../errors';
import { PROPERTIES_SQL, fleetRowsQuery, type FleetRow, type PropertyRow } from './fleet-query';

const isoOfMs = (ms: number | null) => (ms === null ? null : new Date(ms).toISOString());
/** PostgreSQL real → 0.1 °C (3.9 is stored as 3.9000000953…). */
const tenths = (tempC: number | null) => (tempC === null ? null : Math.round(tempC * 10) / 10);

function incidentOf(row: FleetRow): FleetIncidentSummary | null {
  if (!row.incident_id) return null;
  return {
    id: row.incident_id,
    kind: row.incident_kind as FindingKind,
    severity: row.incident_severity as Severity,
    topCause: row.incident_top_cause as CauseCode | null,
    openedAt: new Date(row.incident_opened_at_ms as number).toISOString(),
    openCount: row.incident_open_count ?? 1,
  };
}

function applianceOf(row: FleetRow, nowMs: number): FleetAppliance {
  const style = row.style as ApplianceStyle;
  const age = ageYears(row.installed_on, nowMs);
  return {
    id: row.appliance_id,
    style,
    health: row.health as Health,
    healthSince: isoOfMs(row.health_since_ms),
    freshFoodC: tenths(row.fresh_food_c),
    freezerC: tenths(row.freezer_c),
    ageYears: age,
    pastExpectedLife: age !== null && age > expectedLifeYears(style),
    openIncident: incidentOf(row),
  };
}

function propertyShell(row: PropertyRow): FleetProperty {
  return {
    id: row.id,
    name: row.name,
    city: row.city,
    timeZone: row.time_zone,
    counts: emptyHealthCounts(),
    propertyIncidents: (row.incidents ?? []).map((i) => ({ id: i.id, kind: i.kind as FindingKind, severity: i.severity as Severity, openedAt: new Date(i.opened_at).toISOString() })),
    units: [],
  };
}

/** Groups the ordered rows into property bands of units, keeping the SQL order. */
function group(rows: FleetRow[], properties: Map<string, FleetProperty>, nowMs: number): FleetProperty[] {
  const shown: FleetProperty[] = [];
  let unit = null as FleetUnit | null;
  for (const row of rows) {
    const property = properties.get(row.property_id);
    if (!property) continue;
    if (!property.units.length) shown.push(property);
    if (unit === null || unit.id !== row.unit_id) {
      unit = { id: row.unit_id, label: row.unit_label, floor: row.floor, appliances: [] };
      property.units.push(unit);
    }
    unit.appliances.push(applianceOf(row, nowMs));
    property.counts[row.health as Health] += 1;
  }
  return shown;
}

/** The manager's fleet overview: one statement for the appliances, one for the properties. */
export class FleetService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly clock: Clock,
  ) {}

  async overview(actor: Actor, query: FleetQuery): Promise<FleetOverview> {
    if (actor.role !== 'manager' || !actor.organizationId) throw forbidden('only managers see the fleet overview');
    const now = this.clock.now();
    const rowsQuery = fleetRowsQuery(actor.organizationId, now.toISOString().slice(0, 10), query);
    const [rows, propertyRows]: [FleetRow[], PropertyRow[]] = await Promise.all([
      this.dataSource.query(rowsQuery.sql, rowsQuery.params),
      this.dataSource.query(PROPERTIES_SQL, [actor.organizationId]),
    ]);
    const counts: HealthCounts = emptyHealthCounts();
    for (const row of rows) counts[row.health as Health] += 1;
    const healthFilter = query.health?.length ? new Set<string>(query.health) : null;
    const shownRows = healthFilter ? rows.filter((row) => healthFilter.has(row.health)) : rows;
    const properties = new Map(propertyRows.map((row) => [row.id, propertyShell(row)]));
    return {
      generatedAt: now.toISOString(),
      counts,
      total: shownRows.length,
      properties: group(shownRows, properties, now.getTime()),
      propertyOptions: propertyRows.map((row) => ({ id: row.id, name: row.name })),
    };
  }
}
