/**
 * Power loss at a property: feeds the recent repair findings of the property's appliances
 * to the engine's PropertyCorrelator and keeps one property-level incident per episode.
 * The correlator's episode id follows the median start, which moves as units join, so an
 * episode is matched to the open property incident whose start lies within the window.
 * Unit incidents the episode explains point at it (property_incident_id): the work-order
 * layer then opens one request for the property, not one per unit.
 */
import type { EntityManager } from 'typeorm';
import type { CauseCode, Severity } from '../../shared/domain';
import type { IncidentView } from '../../shared/api/monitor';
import { PropertyCorrelator, type ApplianceFinding, type PowerLossEpisode } from '../detection/property-correlator';
import { DEFAULT_SETTINGS, type DetectionSettings } from '../detection/settings';
import { REPAIR_KINDS, type Finding } from '../detection/types';
import { SILENT_AFTER_INTERVALS } from '../telemetry/liveness';
import type { IncidentChange } from './batch-changes';
import { INCIDENT_COLUMNS, incidentViewOf } from './views';

const MINUTE_MS = 60_000;
/** Findings that ended longer ago than this no longer take part (a day covers any outage's tail). */
const LOOKBACK_MS = 24 * 60 * MINUTE_MS;

export interface PropertyIncidentChange {
  type: IncidentChange;
  incident: IncidentView;
}

interface OpenPropertyIncident {
  id: string;
  startedAtMs: number;
  closedAtMs: number | null;
}

function findingOf(row: Record<string, unknown>): ApplianceFinding {
  const ms = (value: unknown) => (value ? (value as Date).getTime() : null);
  const finding: Finding = {
    id: row.engine_finding_id as string,
    kind: row.kind as Finding['kind'],
    compartment: row.compartment as Finding['compartment'],
    startedAtMs: ms(row.started_at) as number,
    detectedAtMs: ms(row.detected_at) as number,
    endedAtMs: ms(row.ended_at),
    severity: row.severity as Severity,
    probableCauses: row.probable_causes as Finding['probableCauses'],
    minutesAbove4c: Number(row.minutes_above_4c),
    summary: '',
  };
  return { applianceId: row.appliance_id as string, finding };
}

/** What a property incident shows; a change in it is worth an 'updated' event. */
function signatureOf(episode: PowerLossEpisode): string {
  const f = episode.finding;
  return JSON.stringify([episode.applianceIds, f.severity, f.minutesAbove4c, f.endedAtMs]);
}

export class PowerLossWatch {
  private readonly correlator: PropertyCorrelator;

  constructor(private readonly settings: DetectionSettings = { ...DEFAULT_SETTINGS }) {
    this.correlator = new PropertyCorrelator(settings);
  }

  /** Runs inside the batch's transaction; returns the property incidents and absorbed unit incidents that changed. */
  async check(db: EntityManager, propertyId: string): Promise<PropertyIncidentChange[]> {
    const telemetryNowMs = await this.propertyNowMs(db, propertyId);
    if (telemetryNowMs === null) return [];
    const findings = await this.recentFindings(db, propertyId, telemetryNowMs);
    const reporting = await this.reportingAppliances(db, propertyId, telemetryNowMs);
    const episodes = this.correlator.correlate(propertyId, findings, reporting, telemetryNowMs);
    const open = await this.openIncidents(db, propertyId, telemetryNowMs);
    const changes: PropertyIncidentChange[] = [];
    for (const episode of episodes) changes.push(...(await this.keep(db, propertyId, episode, findings, open)));
    return changes;
  }

  /** The property's own clock: its newest reading (backfills and live data alike). */
  private async propertyNowMs(db: EntityManager, propertyId: string): Promise<number | null> {
    const [row] = await db.query(
      `SELECT max(s.last_seen_at) AS at FROM sensor s JOIN appliance a ON a.id = s.appliance_id JOIN unit u ON u.id = a.unit_id WHERE u.property_id = $1`,
      [propertyId],
    );
    return row?.at ? (row.at as Date).getTime() : null;
  }

  private async recentFindings(db: EntityManager, propertyId: string, nowMs: number): Promise<ApplianceFinding[]> {
    const rows: Record<string, unknown>[] = await db.query(
      `SELECT appliance_id, engine_finding_id, kind, compartment, started_at, detected_at, ended_at, severity, probable_causes, minutes_above_4c
         FROM finding WHERE property_id = $1 AND appliance_id IS NOT NULL AND kind = ANY($2::text[]) AND (ended_at IS NULL OR ended_at > $3)`,
      [propertyId, REPAIR_KINDS, new Date(nowMs - LOOKBACK_MS)],
    );
    return rows.map(findingOf);
  }

  /** Appliances whose sensor reported within its liveness limit (telemetry/liveness.ts). */
  private async reportingAppliances(db: EntityManager, propertyId: string, nowMs: number): Promise<number> {
    const [row] = await db.query(
      `SELECT count(DISTINCT a.id)::int AS n FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN sensor s ON s.appliance_id = a.id
        WHERE u.property_id = $1 AND a.archived_at IS NULL AND s.archived_at IS NULL
          AND s.last_seen_at >= $2::timestamptz - make_interval(secs => $3 * s.interval_seconds)`,
      [propertyId, new Date(nowMs), SILENT_AFTER_INTERVALS],
    );
    return Number(row?.n ?? 0);
  }

  /** Property incidents still open, or closed within the lookback (an episode may still be reported). */
  private async openIncidents(db: EntityManager, propertyId: string, nowMs: number): Promise<OpenPropertyIncident[]> {
    const rows: Record<string, unknown>[] = await db.query(
      `SELECT i.id, i.started_at, i.closed_at FROM incident i
        WHERE i.property_id = $1 AND i.level = 'property' AND (i.closed_at IS NULL OR i.closed_at > $2)`,
      [propertyId, new Date(nowMs - LOOKBACK_MS)],
    );
    return rows.map((row) => ({
      id: row.id as string,
      startedAtMs: (row.started_at as Date).getTime(),
      closedAtMs: row.closed_at ? (row.closed_at as Date).getTime() : null,
    }));
  }

  private async keep(db: EntityManager, propertyId: string, episode: PowerLossEpisode, findings: ApplianceFinding[], open: OpenPropertyIncident[]): Promise<PropertyIncidentChange[]> {
    const windowMs = this.settings.powerLossWindowMinutes * MINUTE_MS;
    const match = open.find((incident) => Math.abs(incident.startedAtMs - episode.finding.startedAtMs) <= windowMs);
    const before = match ? await this.signatureOfStored(db, match.id) : null;
    const incidentId = match ? await this.update(db, match.id, episode) : await this.insert(db, propertyId, episode);
    if (!match) open.push({ id: incidentId, startedAtMs: episode.finding.startedAtMs, closedAtMs: episode.finding.endedAtMs });
    await this.upsertPropertyFinding(db, propertyId, incidentId, episode);
    const absorbed = await this.absorb(db, incidentId, episode, findings);
    const changes: PropertyIncidentChange[] = [];
    const after = signatureOf(episode);
    const view = await this.view(db, incidentId);
    if (!match) changes.push({ type: 'opened', incident: view });
    else if (before !== after) changes.push({ type: episode.finding.endedAtMs !== null && match.closedAtMs === null ? 'closed' : 'updated', incident: view });
    for (const unitIncidentId of absorbed) changes.push({ type: 'updated', incident: await this.view(db, unitIncidentId) });
    return changes;
  }

  private async signatureOfStored(db: EntityManager, incidentId: string): Promise<string> {
    const [row] = await db.query(`SELECT appliance_ids, severity, minutes_above_4c, closed_at FROM incident WHERE id = $1`, [incidentId]);
    const closedMs = row.closed_at ? (row.closed_at as Date).getTime() : null;
    return JSON.stringify([[...(row.appliance_ids as string[])].sort(), row.severity, Number(row.minutes_above_4c), closedMs]);
  }

  private async insert(db: EntityManager, propertyId: string, episode: PowerLossEpisode): Promise<string> {
    const f = episode.finding;
    const [row] = await db.query(
      `INSERT INTO incident (organization_id, property_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at, closed_at,
                             severity, top_cause, probable_causes, minutes_above_4c, appliance_ids)
       SELECT p.organization_id, p.id, 'property', $2, 'power', 'power-loss', '{power-loss}', $3, $4, $5, $6, $7, $8::jsonb, $9, $10::uuid[]
         FROM property p WHERE p.id = $1 RETURNING id`,
      [propertyId, f.id, new Date(f.startedAtMs), new Date(f.detectedAtMs), f.endedAtMs ? new Date(f.endedAtMs) : null, f.severity,
        'power-loss' satisfies CauseCode, JSON.stringify(f.probableCauses), Math.round(f.minutesAbove4c), episode.applianceIds],
    );
    return row.id as string;
  }

  private async update(db: EntityManager, incidentId: string, episode: PowerLossEpisode): Promise<string> {
    const f = episode.finding;
    await db.query(
      `UPDATE incident SET closed_at = $2, severity = $3, minutes_above_4c = $4, appliance_ids = $5::uuid[], probable_causes = $6::jsonb, updated_at = now()
        WHERE id = $1`,
      [incidentId, f.endedAtMs ? new Date(f.endedAtMs) : null, f.severity, Math.round(f.minutesAbove4c), episode.applianceIds, JSON.stringify(f.probableCauses)],
    );
    return incidentId;
  }

  /** The property's power-loss finding, keyed by its incident so it stays one row. */
  private async upsertPropertyFinding(db: EntityManager, propertyId: string, incidentId: string, episode: PowerLossEpisode): Promise<void> {
    const f = episode.finding;
    await db.query(
      `INSERT INTO finding (organization_id, property_id, appliance_id, incident_id, engine_finding_id, kind, compartment, started_at, detected_at, ended_at,
                            severity, probable_causes, minutes_above_4c, summary)
       SELECT p.organization_id, p.id, NULL, $2, $3, 'power-loss', 'both', $4, $5, $6, $7, $8::jsonb, $9, $10 FROM property p WHERE p.id = $1
       ON CONFLICT (property_id, engine_finding_id) WHERE appliance_id IS NULL DO UPDATE SET
         ended_at = EXCLUDED.ended_at, severity = EXCLUDED.severity, minutes_above_4c = EXCLUDED.minutes_above_4c, summary = EXCLUDED.summary, updated_at = now()`,
      [propertyId, incidentId, `power-loss:${incidentId}`, new Date(f.startedAtMs), new Date(f.detectedAtMs), f.endedAtMs ? new Date(f.endedAtMs) : null,
        f.severity, JSON.stringify(f.probableCauses), Math.round(f.minutesAbove4c), f.summary],
    );
  }

  /** Marks the unit incidents holding the episode's findings; returns those newly marked. */
  private async absorb(db: EntityManager, incidentId: string, episode: PowerLossEpisode, findings: ApplianceFinding[]): Promise<string[]> {
    const ids = new Set(episode.absorbedFindingIds);
    const absorbed = findings.filter((f) => ids.has(f.finding.id) && episode.applianceIds.includes(f.applianceId));
    if (!absorbed.length) return [];
    const result: [{ id: string }[], number] = await db.query(
      `UPDATE incident i SET property_incident_id = $1, updated_at = now()
         FROM (SELECT DISTINCT f.incident_id FROM finding f JOIN unnest($2::uuid[], $3::text[]) AS t(appliance, engine_id)
                 ON f.appliance_id = t.appliance AND f.engine_finding_id = t.engine_id WHERE f.incident_id IS NOT NULL) AS hit
        WHERE i.id = hit.incident_id AND i.property_incident_id IS DISTINCT FROM $1 RETURNING i.id`,
      [incidentId, absorbed.map((f) => f.applianceId), absorbed.map((f) => f.finding.id)],
    );
    // TypeORM answers an UPDATE with [rows, affected count].
    return result[0].map((row) => row.id);
  }

  private async view(db: EntityManager, incidentId: string): Promise<IncidentView> {
    const [row] = await db.query(`SELECT ${INCIDENT_COLUMNS} FROM incident i WHERE i.id = $1`, [incidentId]);
    return incidentViewOf(row);
  }
}
