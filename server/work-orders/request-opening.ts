/**
 * From an incident to a service request, by the organization's rules:
 * - at or above the auto-open severity, one open request per appliance problem (a later
 *   incident of the same appliance joins the open request);
 * - an appliance incident waits the dispatch hold when its property has enough reporting
 *   appliances for a power loss, so a power loss opens one property request instead of
 *   dispatching every unit; unit requests it absorbs afterwards are merged into it;
 * - a cause that needs no technician (power, sensor) opens the request without dispatch;
 * - otherwise the covering contractor is dispatched.
 */
import type { Logger } from 'pino';
import type { DataSource, EntityManager } from 'typeorm';
import { causeInfo } from '../../shared/causes';
import { SEVERITIES, type CauseCode, type FindingKind, type Severity } from '../../shared/domain';
import type { Priority } from '../../shared/api/work-orders';
import type { Clock } from '../auth/clock';
import { DEFAULT_SETTINGS } from '../detection/settings';
import { AfterCommit } from './after-commit';
import type { TxContext, WorkOrderCore } from './core';
import type { OrgSettingsService } from './org-settings';

export interface RequestOpenerDeps {
  dataSource: DataSource;
  clock: Clock;
  core: WorkOrderCore;
  settings: OrgSettingsService;
  logger: Logger;
}

interface IncidentRow {
  id: string;
  organization_id: string;
  property_id: string;
  unit_id: string | null;
  appliance_id: string | null;
  level: 'appliance' | 'property';
  lane: 'repair' | 'sensor' | 'power';
  kind: FindingKind;
  kinds: FindingKind[];
  severity: Severity;
  top_cause: CauseCode | null;
  minutes_above_4c: number;
  opened_at: Date;
  closed_at: Date | null;
  property_incident_id: string | null;
  appliance_ids: string[];
}

const MINUTE_MS = 60_000;

/** No cooling, or food at risk (a compartment over its limit), is urgent; a slow trend is routine. */
export function priorityOf(incident: Pick<IncidentRow, 'kinds' | 'severity' | 'minutes_above_4c'>): Priority {
  const foodAtRisk = incident.kinds.includes('no-cooling') || incident.kinds.includes('over-temperature') || incident.minutes_above_4c > 0;
  return foodAtRisk || incident.severity === 'critical' ? 'urgent' : 'routine';
}

const KIND_TITLES: Partial<Record<FindingKind, string>> = {
  'no-cooling': 'Not cooling',
  'over-temperature': 'Too warm',
  'warming-trend': 'Warming trend',
};

export function titleOf(incident: Pick<IncidentRow, 'kind' | 'top_cause'>): string {
  const what = KIND_TITLES[incident.kind] ?? 'Temperature trouble';
  return incident.top_cause ? `${what}: probable ${causeInfo(incident.top_cause).title.toLowerCase()}` : what;
}

function atLeast(severity: Severity, threshold: Severity): boolean {
  return SEVERITIES.indexOf(severity) >= SEVERITIES.indexOf(threshold);
}

export class RequestOpener {
  constructor(private readonly deps: RequestOpenerDeps) {}

  /** Applies the rules to one incident's current state; safe to call again and again. */
  async considerIncident(incidentId: string): Promise<void> {
    const after = new AfterCommit();
    await this.deps.dataSource.transaction(async (db) => {
      const [incident] = (await db.query(`SELECT * FROM incident WHERE id = $1`, [incidentId])) as IncidentRow[];
      if (!incident || incident.lane === 'sensor') return;
      const ctx: TxContext = { db, now: this.deps.clock.now(), actor: null, after };
      if (incident.level === 'property') await this.powerLoss(ctx, incident);
      else if (!incident.closed_at && !incident.property_incident_id) await this.applianceTrouble(ctx, incident);
    });
    await after.run(this.deps.logger);
  }

  /**
   * Open appliance incidents of the last day still without a request: the ones waiting out
   * the dispatch hold (the sweeper retries them). Older ones were weighed at every update.
   */
  async pendingIncidentIds(): Promise<string[]> {
    const rows: { id: string }[] = await this.deps.dataSource.query(
      `SELECT i.id FROM incident i
        WHERE i.level = 'appliance' AND i.lane = 'repair' AND i.closed_at IS NULL AND i.property_incident_id IS NULL
          AND i.opened_at > $1::timestamptz - interval '1 day'
          AND NOT EXISTS (SELECT 1 FROM service_request r WHERE (r.appliance_id = i.appliance_id AND r.status = 'open') OR r.incident_id = i.id)
        ORDER BY i.opened_at LIMIT 500`,
      [this.deps.clock.now()],
    );
    return rows.map((row) => row.id);
  }

  private async applianceTrouble(ctx: TxContext, incident: IncidentRow): Promise<void> {
    const settings = await this.deps.settings.forOrganization(incident.organization_id);
    if (!atLeast(incident.severity, settings.autoOpenSeverity)) return;
    // One request per appliance problem: serialise on the appliance row.
    await ctx.db.query(`SELECT id FROM appliance WHERE id = $1 FOR UPDATE`, [incident.appliance_id]);
    const [open] = await ctx.db.query(`SELECT id, incident_id FROM service_request WHERE appliance_id = $1 AND status = 'open'`, [incident.appliance_id]);
    if (open) return this.attach(ctx, open.id, open.incident_id, incident);
    // An incident opens one request at most: once that one is closed (verified, cancelled,
    // merged), the incident's later updates (the cabinet still settling) open nothing.
    const [handled] = await ctx.db.query(`SELECT 1 FROM service_request WHERE incident_id = $1 LIMIT 1`, [incident.id]);
    if (handled) return;
    if (await this.holding(ctx.db, incident, settings.dispatchHoldMinutes, ctx.now)) return;
    await this.open(ctx, incident);
  }

  /**
   * A later incident (or a later state of the same one) joins the open request; the priority
   * only goes up. A monitor request that never had a job follows the diagnosis: its title
   * tracks the probable cause, and once the cause is one a technician fixes, it is dispatched.
   */
  private async attach(ctx: TxContext, requestId: string, currentIncidentId: string | null, incident: IncidentRow): Promise<void> {
    if (currentIncidentId !== incident.id) {
      await ctx.db.query(`UPDATE service_request SET incident_id = $2, updated_at = $3 WHERE id = $1`, [requestId, incident.id, ctx.now]);
      this.deps.core.announceRequest(ctx, requestId, 'incident-attached');
    }
    if (priorityOf(incident) === 'urgent') await this.deps.core.setPriority(ctx, requestId, 'urgent');
    const [request] = await ctx.db.query(
      `SELECT r.source, r.title, EXISTS (SELECT 1 FROM work_order wo WHERE wo.service_request_id = r.id) AS had_job FROM service_request r WHERE r.id = $1`,
      [requestId],
    );
    if (request.source !== 'monitor' || request.had_job) return;
    const title = titleOf(incident);
    if (title !== request.title) await ctx.db.query(`UPDATE service_request SET title = $2, updated_at = $3 WHERE id = $1`, [requestId, title, ctx.now]);
    if (incident.top_cause && causeInfo(incident.top_cause).dispatch) await this.deps.core.dispatchByCoverage(ctx, requestId);
  }

  /** True while a unit's trouble might still turn out to be its property's power loss. */
  private async holding(db: EntityManager, incident: IncidentRow, holdMinutes: number, now: Date): Promise<boolean> {
    if (now.getTime() - incident.opened_at.getTime() >= holdMinutes * MINUTE_MS) return false;
    const [row] = await db.query(
      `SELECT count(*)::int AS n FROM appliance a JOIN unit u ON u.id = a.unit_id WHERE u.property_id = $1 AND a.archived_at IS NULL`,
      [incident.property_id],
    );
    return Number(row.n) >= DEFAULT_SETTINGS.powerLossMinAppliances;
  }

  private async open(ctx: TxContext, incident: IncidentRow): Promise<void> {
    const [request] = await ctx.db.query(
      `INSERT INTO service_request (organization_id, property_id, unit_id, appliance_id, level, source, priority, title, incident_id, opened_at, updated_at)
       VALUES ($1, $2, $3, $4, 'appliance', 'monitor', $5, $6, $7, $8, $8) RETURNING id`,
      [incident.organization_id, incident.property_id, incident.unit_id, incident.appliance_id, priorityOf(incident), titleOf(incident), incident.id, ctx.now],
    );
    const requestId = request.id as string;
    this.deps.core.announceRequest(ctx, requestId, 'opened');
    const undispatched = await this.dispatchIfNeeded(ctx, requestId, incident.top_cause);
    ctx.after.later(() => this.deps.core.deps.notifier.requestOpened(requestId, undispatched));
  }

  /** Returns why nobody was dispatched, or null when the covering contractor was. */
  private async dispatchIfNeeded(ctx: TxContext, requestId: string, topCause: CauseCode | null): Promise<string | null> {
    if (topCause && !causeInfo(topCause).dispatch) {
      return `No technician was dispatched: the probable cause (${causeInfo(topCause).title.toLowerCase()}) needs a check on site first. ${causeInfo(topCause).checks[0]}`;
    }
    const workOrderId = await this.deps.core.dispatchByCoverage(ctx, requestId);
    return workOrderId ? null : 'No contractor covers this property and appliance style: please dispatch one by hand.';
  }

  /** One request for the property's power loss; unit requests it explains merge into it; it closes with the incident. */
  private async powerLoss(ctx: TxContext, incident: IncidentRow): Promise<void> {
    await ctx.db.query(`SELECT id FROM property WHERE id = $1 FOR UPDATE`, [incident.property_id]);
    const [open] = await ctx.db.query(`SELECT id FROM service_request WHERE incident_id = $1 AND level = 'property' AND status = 'open'`, [incident.id]);
    if (incident.closed_at) {
      if (open) await this.deps.core.closeRequest(ctx, open.id, 'closed', 'power restored and the appliances recovered');
      return;
    }
    const requestId = open?.id ?? (await this.openPropertyRequest(ctx, incident));
    await this.mergeAbsorbed(ctx, incident.id, requestId);
  }

  private async openPropertyRequest(ctx: TxContext, incident: IncidentRow): Promise<string> {
    const [request] = await ctx.db.query(
      `INSERT INTO service_request (organization_id, property_id, level, source, priority, title, description, incident_id, opened_at, updated_at)
       VALUES ($1, $2, 'property', 'monitor', 'urgent', $3, $4, $5, $6, $6) RETURNING id`,
      [
        incident.organization_id,
        incident.property_id,
        `Power loss: ${incident.appliance_ids.length} appliances warming together`,
        'Several appliances of this property started warming at the same time: check the breaker, the fuse and the utility before sending a technician.',
        incident.id,
        ctx.now,
      ],
    );
    const requestId = request.id as string;
    this.deps.core.announceRequest(ctx, requestId, 'opened');
    ctx.after.later(() => this.deps.core.deps.notifier.powerLoss(requestId));
    return requestId;
  }

  /** Requests the monitor opened for units the outage explains; tenants' own reports stay as they are. */
  private async mergeAbsorbed(ctx: TxContext, propertyIncidentId: string, intoRequestId: string): Promise<void> {
    const rows: { id: string }[] = await ctx.db.query(
      `SELECT r.id FROM service_request r JOIN incident i ON i.id = r.incident_id
        WHERE i.property_incident_id = $1 AND r.status = 'open' AND r.source = 'monitor' AND r.level = 'appliance' FOR UPDATE OF r`,
      [propertyIncidentId],
    );
    for (const { id } of rows) {
      await this.deps.core.cancelActive(ctx, id, 'the property lost power: the appliance is not at fault');
      await this.deps.core.closeRequest(ctx, id, 'merged', 'part of the property power loss', { mergedIntoId: intoRequestId });
    }
  }
}
