import type { ApplianceView, SensorView } from '../../shared/api/inventory';
import type { ApplianceStyle } from '../../shared/domain';
import { isoOrNull } from './inventory-support';

/**
 * One appliance with its place and its active sensor. Dates come back as text so a `date`
 * column never passes through a local-midnight JS Date.
 */
export const APPLIANCE_SELECT = `
  SELECT a.id, a.unit_id, u.label AS unit_label, u.property_id, p.name AS property_name, a.style, a.model, a.serial,
         a.installed_on::text AS installed_on, a.warranty_ends_on::text AS warranty_ends_on, a.archived_at, a.created_at,
         s.id AS sensor_id, s.device_id, s.interval_seconds, s.last_seen_at
    FROM appliance a
    JOIN unit u ON u.id = a.unit_id
    JOIN property p ON p.id = u.property_id
    LEFT JOIN LATERAL (
      SELECT id, device_id, interval_seconds, last_seen_at FROM sensor
       WHERE appliance_id = a.id AND archived_at IS NULL ORDER BY created_at DESC LIMIT 1
    ) s ON TRUE`;

export interface ApplianceRow {
  id: string;
  unit_id: string;
  unit_label: string;
  property_id: string;
  property_name: string;
  style: ApplianceStyle;
  model: string;
  serial: string;
  installed_on: string | null;
  warranty_ends_on: string | null;
  archived_at: Date | null;
  created_at: Date;
  sensor_id: string | null;
  device_id: string | null;
  interval_seconds: number | null;
  last_seen_at: Date | null;
}

export function toApplianceView(row: ApplianceRow): ApplianceView {
  return {
    id: row.id,
    unitId: row.unit_id,
    unitLabel: row.unit_label,
    propertyId: row.property_id,
    propertyName: row.property_name,
    style: row.style,
    model: row.model,
    serial: row.serial,
    installedOn: row.installed_on,
    warrantyEndsOn: row.warranty_ends_on,
    archivedAt: isoOrNull(row.archived_at),
    createdAt: row.created_at.toISOString(),
    sensor:
      row.sensor_id && row.device_id
        ? { id: row.sensor_id, deviceId: row.device_id, intervalSeconds: row.interval_seconds ?? 0, lastSeenAt: isoOrNull(row.last_seen_at) }
        : null,
  };
}

/** A sensor with the appliance it sits in. Every sensor the inventory pairs has one. */
export const SENSOR_SELECT = `
  SELECT s.id, s.device_id, s.appliance_id, s.interval_seconds, s.last_seen_at, s.last_heard_at, s.archived_at, s.created_at,
         a.style, u.label AS unit_label, p.name AS property_name
    FROM sensor s
    JOIN appliance a ON a.id = s.appliance_id
    JOIN unit u ON u.id = a.unit_id
    JOIN property p ON p.id = u.property_id`;

export interface SensorRow {
  id: string;
  device_id: string;
  appliance_id: string;
  interval_seconds: number;
  last_seen_at: Date | null;
  last_heard_at: Date | null;
  archived_at: Date | null;
  created_at: Date;
  style: ApplianceStyle;
  unit_label: string;
  property_name: string;
}

export function toSensorView(row: SensorRow): SensorView {
  return {
    id: row.id,
    deviceId: row.device_id,
    applianceId: row.appliance_id,
    intervalSeconds: row.interval_seconds,
    lastSeenAt: isoOrNull(row.last_seen_at),
    lastHeardAt: isoOrNull(row.last_heard_at),
    style: row.style,
    unitLabel: row.unit_label,
    propertyName: row.property_name,
    archivedAt: isoOrNull(row.archived_at),
    createdAt: row.created_at.toISOString(),
  };
}
