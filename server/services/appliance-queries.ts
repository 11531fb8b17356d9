/** The appliance page's reads: the appliance with its place and monitor state, sensors, incidents and their findings. */
import type { DataSource } from 'typeorm';
import type { ApplianceSensorView, FindingView, IncidentWithFindings } from '../../shared/api/appliances';
import type { Compartment, FindingKind, Health, Severity } from '../../shared/domain';
import type { EngineState } from '../detection/state';
import { INCIDENT_COLUMNS, incidentViewOf } from '../monitor/views';

export interface ApplianceRow {
  id: string;
  style: string;
  model: string;
  serial: string;
  installed_on: string | null;
  warranty_ends_on: string | null;
  archived_at: Date | null;
  unit_id: string;
  unit_label: string;
  property_id: string;
  property_name: string;
  address_line1: string;
  address_line2: string | null;
  city: string;
  region: string;
  postal_code: string;
  time_zone: string;
  organization_id: string;
  health: Health | null;
  health_since: Date | null;
  last_reading_at: Date | null;
  fresh_food_c: number | null;
  freezer_c: number | null;
  engine_state: EngineState | null;
}

const iso = (value: Date | null) => (value ? value.toISOString() : null);

export async function applianceRow(db: DataSource, applianceId: string): Promise<ApplianceRow | null> {
  const [row] = await db.query(
    `SELECT a.id, a.style, a.model, a.serial, a.installed_on::text AS installed_on, a.warranty_ends_on::text AS warranty_ends_on, a.archived_at,
            u.id AS unit_id, u.label AS unit_label, p.id AS property_id, p.name AS property_name, p.address_line1, p.address_line2,
            p.city, p.region, p.postal_code, p.time_zone, p.organization_id,
            m.health, m.health_since, m.last_reading_at, m.fresh_food_c, m.freezer_c, m.engine_state
       FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
       LEFT JOIN appliance_monitor m ON m.appliance_id = a.id
      WHERE a.id = $1`,
    [applianceId],
  );
  return row ?? null;
}

export async function sensorsOf(db: DataSource, applianceId: string): Promise<ApplianceSensorView[]> {
  const rows: { id: string; device_id: string; interval_seconds: number; last_seen_at: Date | null }[] = await db.query(
    `SELECT id, device_id, interval_seconds, last_seen_at FROM sensor WHERE appliance_id = $1 AND archived_at IS NULL ORDER BY device_id`,
    [applianceId],
  );
  return rows.map((row) => ({ id: row.id, deviceId: row.device_id, intervalSeconds: row.interval_seconds, lastSeenAt: iso(row.last_seen_at) }));
}

function findingViewOf(row: Record<string, unknown>): FindingView {
  return {
    id: row.id as string,
    kind: row.kind as FindingKind,
    compartment: row.compartment as Compartment,
    startedAt: (row.started_at as Date).toISOString(),
    detectedAt: (row.detected_at as Date).toISOString(),
    endedAt: iso(row.ended_at as Date | null),
    severity: row.severity as Severity,
    summary: row.summary as string,
    forecastCrossingAt: iso(row.forecast_crossing_at as Date | null),
  };
}

/**
 * The appliance's incidents, open ones first then the most recent, each with its findings
 * in the order they were detected. Two statements whatever the count.
 */
export async function incidentsOf(db: DataSource, applianceId: string, limit: number): Promise<IncidentWithFindings[]> {
  const rows: Record<string, unknown>[] = await db.query(
    `SELECT ${INCIDENT_COLUMNS} FROM incident i WHERE i.appliance_id = $1
      ORDER BY (i.closed_at IS NULL) DESC, i.opened_at DESC LIMIT $2`,
    [applianceId, limit],
  );
  if (!rows.length) return [];
  const findings: Record<string, unknown>[] = await db.query(
    `SELECT id, incident_id, kind, compartment, started_at, detected_at, ended_at, severity, summary, forecast_crossing_at
       FROM finding WHERE incident_id = ANY($1::uuid[]) ORDER BY detected_at, id`,
    [rows.map((row) => row.id)],
  );
  return rows.map((row) => ({
    ...incidentViewOf(row),
    findings: findings.filter((finding) => finding.incident_id === row.id).map(findingViewOf),
  }));
}
