/**
 * The fleet overview's two statements. The first returns one row per active appliance of
 * the organization that matches every filter except health (the counts need those), with
 * its unit, property, current health, sensors and worst open incident; the second the
 * organization's properties with their open property-level incidents. Both are bounded by
 * the organization id, so the indexes on property(organization_id), unit(property_id),
 * appliance(unit_id), sensor(appliance_id) and the open-incident index carry them.
 */
import type { FleetQuery } from '../../shared/api/fleet';
import { EXPECTED_SERVICE_LIFE_YEARS } from '../../shared/api/fleet-constants';

export interface FleetRow {
  appliance_id: string;
  style: string;
  installed_on: string | null;
  unit_id: string;
  unit_label: string;
  floor: number | null;
  property_id: string;
  health: string;
  health_since_ms: number | null;
  fresh_food_c: number | null;
  freezer_c: number | null;
  incident_id: string | null;
  incident_kind: string | null;
  incident_severity: string | null;
  incident_top_cause: string | null;
  incident_opened_at_ms: number | null;
  incident_open_count: number | null;
}

export interface PropertyRow {
  id: string;
  name: string;
  city: string;
  time_zone: string;
  incidents: { id: string; kind: string; severity: string; opened_at: string }[] | null;
}

const SEVERITY_ORDER = `ARRAY['info','watch','urgent','critical']`;
const YEAR_DAYS = 365.2425;

/** Epoch milliseconds as a plain number: cheaper to read than thousands of timestamps. */
const EPOCH_MS = (column: string) => `(extract(epoch FROM ${column}) * 1000)::float8`;

function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (char) => `\\${char}`)}%`;
}

/** The style's expected life, in years. */
const LIFE_YEARS = `(CASE WHEN a.style IN ('upright-freezer','chest-freezer') THEN ${EXPECTED_SERVICE_LIFE_YEARS.freezer} ELSE ${EXPECTED_SERVICE_LIFE_YEARS.refrigerator} END)`;

/** The condition of an age band; `today` is the parameter holding today's date. */
function ageCondition(band: Exclude<FleetQuery['age'], 'unknown' | undefined>, today: string): string {
  const ageYears = `((${today}::date - a.installed_on) / ${YEAR_DAYS})`;
  switch (band) {
    case 'under-5':
      return `${ageYears} < 5`;
    case '5-to-10':
      return `${ageYears} BETWEEN 5 AND 10`;
    case 'over-10':
      return `${ageYears} > 10`;
    case 'past-life':
      return `${ageYears} > ${LIFE_YEARS}`;
  }
}

export function fleetRowsQuery(organizationId: string, today: string, query: FleetQuery): { sql: string; params: unknown[] } {
  const params: unknown[] = [organizationId];
  const where: string[] = [];
  const add = (value: unknown) => `$${params.push(value)}`;
  if (query.property?.length) where.push(`p.id = ANY(${add(query.property)}::uuid[])`);
  if (query.style?.length) where.push(`a.style = ANY(${add(query.style)}::text[])`);
  if (query.age === 'unknown') where.push('a.installed_on IS NULL');
  else if (query.age) where.push(ageCondition(query.age, add(today)));
  if (query.q) {
    const pattern = add(likePattern(query.q));
    where.push(`(u.label ILIKE ${pattern} OR EXISTS (SELECT 1 FROM sensor ss WHERE ss.appliance_id = a.id AND ss.archived_at IS NULL AND ss.device_id ILIKE ${pattern}))`);
  }
  const sql = `
    WITH open_incident AS (
      SELECT DISTINCT ON (i.appliance_id) i.appliance_id, i.id, i.kind, i.severity, i.top_cause, i.opened_at,
             count(*) OVER (PARTITION BY i.appliance_id)::int AS open_count
        FROM incident i
       WHERE i.organization_id = $1 AND i.closed_at IS NULL AND i.appliance_id IS NOT NULL
       ORDER BY i.appliance_id, array_position(${SEVERITY_ORDER}, i.severity) DESC, i.opened_at DESC
    )
    SELECT a.id AS appliance_id, a.style, a.installed_on::text AS installed_on,
           u.id AS unit_id, u.label AS unit_label, u.floor, p.id AS property_id,
           coalesce(m.health, 'silent') AS health, ${EPOCH_MS('m.health_since')} AS health_since_ms,
           m.fresh_food_c, m.freezer_c,
           oi.id AS incident_id, oi.kind AS incident_kind, oi.severity AS incident_severity, oi.top_cause AS incident_top_cause,
           ${EPOCH_MS('oi.opened_at')} AS incident_opened_at_ms, oi.open_count AS incident_open_count
      FROM property p
      JOIN unit u ON u.property_id = p.id AND u.archived_at IS NULL
      JOIN appliance a ON a.unit_id = u.id AND a.archived_at IS NULL
      LEFT JOIN appliance_monitor m ON m.appliance_id = a.id
      LEFT JOIN open_incident oi ON oi.appliance_id = a.id
     WHERE p.organization_id = $1 AND p.archived_at IS NULL ${where.map((condition) => `AND ${condition}`).join(' ')}
     ORDER BY p.name, p.id, u.floor NULLS LAST, u.label, a.created_at, a.id`;
  return { sql, params };
}

export const PROPERTIES_SQL = `
  SELECT p.id, p.name, p.city, p.time_zone,
         (SELECT json_agg(json_build_object('id', i.id, 'kind', i.kind, 'severity', i.severity, 'opened_at', i.opened_at) ORDER BY i.opened_at DESC)
            FROM incident i WHERE i.property_id = p.id AND i.level = 'property' AND i.closed_at IS NULL) AS incidents
    FROM property p
   WHERE p.organization_id = $1 AND p.archived_at IS NULL
   ORDER BY p.name, p.id`;
