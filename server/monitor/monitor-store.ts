/**
 * The monitor's reads and writes. Writes are set-based (one statement per table per
 * batch, arrays through unnest) because a batch may touch thousands of appliances.
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { Health } from '../../shared/domain';
import type { ProbeErrorFlag } from '../../shared/telemetry';
import type { Incident } from '../detection/incidents';
import type { EngineState } from '../detection/state';
import type { Finding } from '../detection/types';
import type { ApplianceRef, MonitoredAppliance, SavedMonitorState } from './monitored-appliance';
import { incidentKindOf } from './views';

type Db = DataSource | EntityManager;

export interface LoadedAppliance {
  ref: ApplianceRef;
  saved: SavedMonitorState | null;
}

/** Used when an appliance has no sensor row (its readings cannot arrive anyway). */
const DEFAULT_INTERVAL_SECONDS = 300;

export async function loadAppliances(db: Db, applianceIds: string[]): Promise<Map<string, LoadedAppliance>> {
  const rows: Record<string, unknown>[] = await db.query(
    `SELECT a.id, a.style, a.unit_id, u.property_id, p.organization_id,
            (SELECT min(s.interval_seconds) FROM sensor s WHERE s.appliance_id = a.id AND s.archived_at IS NULL) AS interval_seconds,
            m.engine_state, m.tracker_state, m.health, m.health_since, m.last_reading_at, m.fresh_food_c, m.freezer_c
       FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
       LEFT JOIN appliance_monitor m ON m.appliance_id = a.id
      WHERE a.id = ANY($1::uuid[])`,
    [applianceIds],
  );
  const loaded = new Map<string, LoadedAppliance>();
  for (const row of rows) {
    const ref: ApplianceRef = {
      applianceId: row.id as string,
      unitId: row.unit_id as string,
      propertyId: row.property_id as string,
      organizationId: row.organization_id as string,
      style: row.style as ApplianceRef['style'],
      intervalSeconds: Number(row.interval_seconds ?? DEFAULT_INTERVAL_SECONDS),
    };
    loaded.set(ref.applianceId, { ref, saved: savedStateOf(row) });
  }
  return loaded;
}

function savedStateOf(row: Record<string, unknown>): SavedMonitorState | null {
  if (!row.engine_state) return null;
  const lastAt = row.last_reading_at as Date | null;
  return {
    engineState: row.engine_state as SavedMonitorState['engineState'],
    trackerState: row.tracker_state as SavedMonitorState['trackerState'],
    health: row.health as Health,
    healthSinceMs: (row.health_since as Date).getTime(),
    lastReading: lastAt ? { atMs: lastAt.getTime(), freshFoodC: row.fresh_food_c as number | null, freezerC: row.freezer_c as number | null } : null,
  };
}

export interface CatchUpReading {
  atMs: number;
  freshFoodC: number | null;
  freezerC: number | null;
  freshFoodFlag: ProbeErrorFlag | null;
  freezerFlag: ProbeErrorFlag | null;
  doorOpen: boolean | null;
}

/**
 * Readings stored but never judged: committed by the ingest while the server was going
 * down, before the monitor saved its state. Bounded, so a long outage costs one query.
 */
export async function readingsBetween(db: Db, applianceId: string, afterMs: number, beforeMs: number, limit = 5000): Promise<CatchUpReading[]> {
  const rows: Record<string, unknown>[] = await db.query(
    `SELECT (extract(epoch FROM at) * 1000)::float8 AS at_ms, fresh_food_c, freezer_c, fresh_food_flag, freezer_flag, door_open
       FROM reading WHERE appliance_id = $1 AND at > $2 AND at < $3 ORDER BY at LIMIT $4`,
    [applianceId, new Date(afterMs), new Date(beforeMs), limit],
  );
  return rows.map((row) => ({
    atMs: Number(row.at_ms),
    freshFoodC: row.fresh_food_c as number | null,
    freezerC: row.freezer_c as number | null,
    freshFoodFlag: row.fresh_food_flag as ProbeErrorFlag | null,
    freezerFlag: row.freezer_flag as ProbeErrorFlag | null,
    doorOpen: row.door_open as boolean | null,
  }));
}

const toDate = (ms: number | null | undefined) => (ms === null || ms === undefined ? null : new Date(ms));

/** One row per touched appliance: engine snapshot, tracker state, health and the last reading. */
export async function saveStates(db: Db, entries: { appliance: MonitoredAppliance; engineState: EngineState }[]): Promise<void> {
  if (!entries.length) return;
  const appliances = entries.map((entry) => entry.appliance);
  await db.query(
    `INSERT INTO appliance_monitor AS m (appliance_id, style, engine_state, tracker_state, health, health_since, last_reading_at, fresh_food_c, freezer_c, updated_at)
     SELECT t.id, t.style, t.engine::jsonb, t.tracker::jsonb, t.health, t.since, t.last_at, t.fresh, t.freezer, now()
       FROM unnest($1::uuid[], $2::text[], $3::text[], $4::text[], $5::text[], $6::timestamptz[], $7::timestamptz[], $8::real[], $9::real[])
         AS t(id, style, engine, tracker, health, since, last_at, fresh, freezer)
     ON CONFLICT (appliance_id) DO UPDATE SET style = EXCLUDED.style, engine_state = EXCLUDED.engine_state, tracker_state = EXCLUDED.tracker_state,
       health = EXCLUDED.health, health_since = EXCLUDED.health_since, last_reading_at = EXCLUDED.last_reading_at,
       fresh_food_c = EXCLUDED.fresh_food_c, freezer_c = EXCLUDED.freezer_c, updated_at = now()`,
    [
      appliances.map((a) => a.ref.applianceId),
      appliances.map((a) => a.ref.style),
      entries.map((entry) => JSON.stringify(entry.engineState)),
      appliances.map((a) => JSON.stringify(a.tracker.snapshot())),
      appliances.map((a) => a.health),
      appliances.map((a) => new Date(a.healthSinceMs)),
      appliances.map((a) => toDate(a.lastReading?.atMs)),
      appliances.map((a) => a.lastReading?.freshFoodC ?? null),
      appliances.map((a) => a.lastReading?.freezerC ?? null),
    ],
  );
}

/** Only the health (the liveness sweep changes nothing else). */
export async function saveHealth(db: Db, applianceId: string, health: Health, sinceMs: number): Promise<void> {
  await db.query(`UPDATE appliance_monitor SET health = $2, health_since = $3, updated_at = now() WHERE appliance_id = $1`, [applianceId, health, new Date(sinceMs)]);
}

export interface FindingWrite {
  ref: ApplianceRef;
  finding: Finding;
}

/** Upserts unit findings by (appliance, engine finding id). */
export async function upsertFindings(db: Db, writes: FindingWrite[]): Promise<void> {
  if (!writes.length) return;
  await db.query(
    `INSERT INTO finding AS f (organization_id, property_id, appliance_id, engine_finding_id, kind, compartment, started_at, detected_at, ended_at,
                               severity, probable_causes, minutes_above_4c, forecast_crossing_at, summary, updated_at)
     SELECT t.org, t.property, t.appliance, t.engine_id, t.kind, t.compartment, t.started, t.detected, t.ended, t.severity, t.causes::jsonb, t.minutes, t.forecast, t.summary, now()
       FROM unnest($1::uuid[], $2::uuid[], $3::uuid[], $4::text[], $5::text[], $6::text[], $7::timestamptz[], $8::timestamptz[], $9::timestamptz[],
                   $10::text[], $11::text[], $12::int[], $13::timestamptz[], $14::text[])
         AS t(org, property, appliance, engine_id, kind, compartment, started, detected, ended, severity, causes, minutes, forecast, summary)
     ON CONFLICT (appliance_id, engine_finding_id) WHERE appliance_id IS NOT NULL DO UPDATE SET
       kind = EXCLUDED.kind, compartment = EXCLUDED.compartment, started_at = EXCLUDED.started_at, detected_at = EXCLUDED.detected_at,
       ended_at = EXCLUDED.ended_at, severity = EXCLUDED.severity, probable_causes = EXCLUDED.probable_causes,
       minutes_above_4c = EXCLUDED.minutes_above_4c, forecast_crossing_at = EXCLUDED.forecast_crossing_at, summary = EXCLUDED.summary, updated_at = now()`,
    [
      writes.map((w) => w.ref.organizationId),
      writes.map((w) => w.ref.propertyId),
      writes.map((w) => w.ref.applianceId),
      writes.map((w) => w.finding.id),
      writes.map((w) => w.finding.kind),
      writes.map((w) => w.finding.compartment),
      writes.map((w) => new Date(w.finding.startedAtMs)),
      writes.map((w) => new Date(w.finding.detectedAtMs)),
      writes.map((w) => toDate(w.finding.endedAtMs)),
      writes.map((w) => w.finding.severity),
      writes.map((w) => JSON.stringify(w.finding.probableCauses)),
      writes.map((w) => Math.round(w.finding.minutesAbove4c)),
      writes.map((w) => toDate(w.finding.forecastCrossingAtMs)),
      writes.map((w) => w.finding.summary),
    ],
  );
}

export interface IncidentWrite {
  ref: ApplianceRef;
  incident: Incident;
}

/** Upserts unit incidents by (appliance, tracker id); returns the stored ids by `${applianceId}|${trackerId}`. */
export async function upsertIncidents(db: Db, writes: IncidentWrite[]): Promise<Map<string, string>> {
  if (!writes.length) return new Map();
  const rows: { id: string; appliance_id: string; engine_incident_id: string }[] = await db.query(
    `INSERT INTO incident AS i (organization_id, property_id, unit_id, appliance_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at,
                                closed_at, severity, top_cause, probable_causes, minutes_above_4c, updated_at)
     SELECT t.org, t.property, t.unit, t.appliance, 'appliance', t.engine_id, t.lane, t.kind, string_to_array(t.kinds, ','), t.started, t.opened,
            t.closed, t.severity, t.top_cause, t.causes::jsonb, t.minutes, now()
       FROM unnest($1::uuid[], $2::uuid[], $3::uuid[], $4::uuid[], $5::text[], $6::text[], $7::text[], $8::text[], $9::timestamptz[], $10::timestamptz[],
                   $11::timestamptz[], $12::text[], $13::text[], $14::text[], $15::int[])
         AS t(org, property, unit, appliance, engine_id, lane, kind, kinds, started, opened, closed, severity, top_cause, causes, minutes)
     ON CONFLICT (appliance_id, engine_incident_id) WHERE appliance_id IS NOT NULL DO UPDATE SET
       kind = EXCLUDED.kind, kinds = EXCLUDED.kinds, started_at = EXCLUDED.started_at, closed_at = EXCLUDED.closed_at, severity = EXCLUDED.severity,
       top_cause = EXCLUDED.top_cause, probable_causes = EXCLUDED.probable_causes, minutes_above_4c = EXCLUDED.minutes_above_4c, updated_at = now()
     RETURNING id, appliance_id, engine_incident_id`,
    [
      writes.map((w) => w.ref.organizationId),
      writes.map((w) => w.ref.propertyId),
      writes.map((w) => w.ref.unitId),
      writes.map((w) => w.ref.applianceId),
      writes.map((w) => w.incident.id),
      writes.map((w) => w.incident.lane),
      writes.map((w) => incidentKindOf(w.incident.kinds)),
      writes.map((w) => w.incident.kinds.join(',')),
      writes.map((w) => new Date(w.incident.startedAtMs)),
      writes.map((w) => new Date(w.incident.openedAtMs)),
      writes.map((w) => toDate(w.incident.closedAtMs)),
      writes.map((w) => w.incident.severity),
      writes.map((w) => w.incident.probableCauses[0]?.code ?? null),
      writes.map((w) => JSON.stringify(w.incident.probableCauses)),
      writes.map((w) => Math.round(w.incident.minutesAbove4c)),
    ],
  );
  return new Map(rows.map((row) => [`${row.appliance_id}|${row.engine_incident_id}`, row.id]));
}

/** Points each incident's findings at it. */
export async function linkFindings(db: Db, links: { applianceId: string; incidentId: string; findingIds: string[] }[]): Promise<void> {
  if (!links.length) return;
  await db.query(
    `UPDATE finding f SET incident_id = t.incident
       FROM unnest($1::uuid[], $2::uuid[], $3::text[]) AS t(appliance, incident, engine_id)
      WHERE f.appliance_id = t.appliance AND f.engine_finding_id = t.engine_id AND f.incident_id IS DISTINCT FROM t.incident`,
    [
      links.flatMap((l) => l.findingIds.map(() => l.applianceId)),
      links.flatMap((l) => l.findingIds.map(() => l.incidentId)),
      links.flatMap((l) => l.findingIds),
    ],
  );
}
