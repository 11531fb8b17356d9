/**
 * The tenant's side: their unit's appliances as one clear status each (the brief's health
 * words, current temperatures, time above 4 °C with food-safety guidance), and the problem
 * report, which joins the appliance's open request when there is one.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { URGENT_SYMPTOMS, SYMPTOMS, type TenantHomeView, type TenantReport, type TenantReportResult } from '../../shared/api/tenant';
import type { ApplianceStyle, Health } from '../../shared/domain';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { badRequest, forbidden, notFound } from '../errors';
import type { PreparedUpload } from '../storage/uploads';
import { AfterCommit } from '../work-orders/after-commit';
import type { TxContext, WorkOrderCore } from '../work-orders/core';
import { foodSafetyGuidance, HEALTH_TEXT } from '../work-orders/food-safety';
import { applianceWords } from '../work-orders/job-context';
import { MERGED_SYMPTOMS, requestViews } from '../work-orders/views';
import type { AttachmentsService, UploadedFile } from './attachments';

export interface TenantHomeDeps {
  dataSource: DataSource;
  clock: Clock;
  core: WorkOrderCore;
  attachments: AttachmentsService;
  logger: Logger;
}

function titleOfReport(report: TenantReport, style: ApplianceStyle): string {
  const first = report.symptoms[0];
  return `Tenant report: ${SYMPTOMS[first].toLowerCase()}${report.symptoms.length > 1 ? ' and more' : ''} (${applianceWords(style)})`;
}

export class TenantHomeService {
  constructor(private readonly deps: TenantHomeDeps) {}

  async home(actor: Actor): Promise<TenantHomeView> {
    const unitId = this.unitOf(actor);
    const [unit] = await this.deps.dataSource.query(`SELECT u.id, u.label, p.name AS property_name FROM unit u JOIN property p ON p.id = u.property_id WHERE u.id = $1`, [unitId]);
    if (!unit) throw notFound('unit');
    const rows: Record<string, unknown>[] = await this.deps.dataSource.query(
      `SELECT a.id, a.style, m.health, m.fresh_food_c, m.freezer_c, m.last_reading_at,
              (SELECT max(i.minutes_above_4c) FROM incident i WHERE i.appliance_id = a.id AND i.closed_at IS NULL AND i.lane = 'repair') AS minutes_above_4c
         FROM appliance a LEFT JOIN appliance_monitor m ON m.appliance_id = a.id
        WHERE a.unit_id = $1 AND a.archived_at IS NULL ORDER BY a.created_at`,
      [unitId],
    );
    const open = await requestViews(this.deps.dataSource, `r.unit_id = $1 AND r.status = 'open'`, [unitId]);
    return {
      unit: { id: unit.id, label: unit.label, propertyName: unit.property_name },
      appliances: rows.map((row) => {
        const health = (row.health as Health | null) ?? 'silent';
        return {
          id: row.id as string,
          style: row.style as ApplianceStyle,
          health,
          healthText: HEALTH_TEXT[health],
          freshFoodC: (row.fresh_food_c as number | null) ?? null,
          freezerC: (row.freezer_c as number | null) ?? null,
          lastReadingAt: row.last_reading_at ? (row.last_reading_at as Date).toISOString() : null,
          guidance: foodSafetyGuidance(health, Number(row.minutes_above_4c ?? 0)),
          openRequest: open.find((request) => request.applianceId === row.id) ?? null,
        };
      }),
    };
  }

  /** Files the report: joins the appliance's open request or opens one; photos are checked before anything is written. */
  async report(actor: Actor, report: TenantReport, files: UploadedFile[]): Promise<TenantReportResult> {
    const unitId = this.unitOf(actor);
    const appliance = await this.applianceFor(unitId, report.applianceId);
    const staged = files.length ? await this.deps.attachments.stage(files, appliance.organizationId) : [];
    const after = new AfterCommit();
    let outcome: { requestId: string; attached: boolean };
    try {
      outcome = await this.deps.dataSource.transaction((db) => this.file({ db, now: this.deps.clock.now(), actor, after }, appliance, report, staged));
    } catch (error) {
      await this.deps.attachments.discard(staged);
      throw error;
    }
    await after.run(this.deps.logger);
    const [request] = await requestViews(this.deps.dataSource, 'r.id = $1', [outcome.requestId]);
    return { attached: outcome.attached, request };
  }

  private async file(ctx: TxContext, appliance: { id: string; style: ApplianceStyle; organizationId: string; propertyId: string; unitId: string }, report: TenantReport, staged: PreparedUpload[]) {
    await ctx.db.query(`SELECT id FROM appliance WHERE id = $1 FOR UPDATE`, [appliance.id]);
    const [open] = await ctx.db.query(`SELECT id FROM service_request WHERE appliance_id = $1 AND status = 'open'`, [appliance.id]);
    const urgent = report.symptoms.some((symptom) => URGENT_SYMPTOMS.includes(symptom));
    const requestId: string = open?.id ?? (await this.openRequest(ctx, appliance, report, urgent ? 'urgent' : 'routine'));
    if (open) {
      await ctx.db.query(`UPDATE service_request SET symptoms = ${MERGED_SYMPTOMS('symptoms', '$2::text[]')}, updated_at = $3 WHERE id = $1`, [requestId, report.symptoms, ctx.now]);
      if (urgent) await this.deps.core.setPriority(ctx, requestId, 'urgent');
      this.deps.core.announceRequest(ctx, requestId, 'tenant-report');
    }
    const [row] = await ctx.db.query(
      `INSERT INTO tenant_report (service_request_id, unit_id, appliance_id, reporter_user_id, symptoms, description, access_windows, pet_present, created_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7::jsonb, $8, $9) RETURNING id`,
      [requestId, appliance.unitId, appliance.id, ctx.actor?.id, report.symptoms, report.description, JSON.stringify(report.accessWindows), report.petPresent, ctx.now],
    );
    await this.deps.attachments.insertRows(ctx.db, staged, { tenantReportId: row.id }, appliance.organizationId, 'photo', ctx.actor as Actor);
    const reporterId = (ctx.actor as Actor).id;
    const attached = !!open;
    ctx.after.later(() => this.deps.core.deps.notifier.tenantReport(requestId, reporterId, attached));
    return { requestId, attached };
  }

  private async openRequest(ctx: TxContext, appliance: { id: string; style: ApplianceStyle; organizationId: string; propertyId: string; unitId: string }, report: TenantReport, priority: 'urgent' | 'routine'): Promise<string> {
    const [row] = await ctx.db.query(
      `INSERT INTO service_request (organization_id, property_id, unit_id, appliance_id, level, source, priority, title, description, symptoms, opened_by_user_id, opened_at, updated_at)
       VALUES ($1, $2, $3, $4, 'appliance', 'tenant', $5, $6, $7, $8, $9, $10, $10) RETURNING id`,
      [appliance.organizationId, appliance.propertyId, appliance.unitId, appliance.id, priority, titleOfReport(report, appliance.style), report.description, report.symptoms, ctx.actor?.id, ctx.now],
    );
    this.deps.core.announceRequest(ctx, row.id, 'opened');
    return row.id as string;
  }

  private unitOf(actor: Actor): string {
    if (actor.role !== 'tenant' || !actor.unitId) throw forbidden('only a tenant with a unit has a home page');
    return actor.unitId;
  }

  /** The reported appliance of the tenant's own unit; the only one when the unit has just one. */
  private async applianceFor(unitId: string, applianceId: string | undefined) {
    const rows: { id: string; style: ApplianceStyle; organization_id: string; property_id: string }[] = await this.deps.dataSource.query(
      `SELECT a.id, a.style, p.organization_id, p.id AS property_id FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
        WHERE a.unit_id = $1 AND a.archived_at IS NULL`,
      [unitId],
    );
    const chosen = applianceId ? rows.find((row) => row.id === applianceId) : rows.length === 1 ? rows[0] : undefined;
    if (applianceId && !chosen) throw notFound('appliance');
    if (!chosen) throw badRequest(rows.length ? 'say which appliance (applianceId)' : 'your unit has no appliance on record');
    return { id: chosen.id, style: chosen.style, organizationId: chosen.organization_id, propertyId: chosen.property_id, unitId };
  }
}
