/**
 * Work orders as the contractor works them and the manager oversees them: accept,
 * decline (passed to the backup when there is one), schedule, arrive, complete, record
 * visits, parts, labour and notes; the manager approves or disputes the cost and may
 * verify by hand when no telemetry can. Every change is recorded with who and when.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Page } from '../../shared/api/users';
import type {
  CompleteRequest,
  RecordLabourRequest,
  RecordPartRequest,
  ScheduleRequest,
  WorkOrderExportQuery,
  WorkOrderQuery,
  WorkOrderSummary,
  WorkOrderView,
} from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { conflict, forbidden, notFound } from '../errors';
import { AfterCommit } from '../work-orders/after-commit';
import type { TxContext, WorkOrderCore, WorkOrderRow } from '../work-orders/core';
import { recordChange } from '../work-orders/log';
import type { OrgSettingsService } from '../work-orders/org-settings';
import { isWorkable } from '../work-orders/states';
import type { Verification } from '../work-orders/verification';
import { workOrderView } from '../work-orders/views';
import { WorkOrderList } from './work-order-list';
import type { WorkOrderPlace, WorkOrderScope } from '../work-orders/work-order-scope';

export interface WorkOrdersDeps {
  dataSource: DataSource;
  clock: Clock;
  scope: WorkOrderScope;
  core: WorkOrderCore;
  settings: OrgSettingsService;
  verification: Verification;
  logger: Logger;
}

const MINUTE_MS = 60_000;

export class WorkOrdersService {
  private readonly rows: WorkOrderList;

  constructor(private readonly deps: WorkOrdersDeps) {
    this.rows = new WorkOrderList(deps);
  }

  /** Filters, sorting and paging live in WorkOrderList (services/work-order-list.ts), shared with the CSV export. */
  list(actor: Actor, query: WorkOrderQuery): Promise<Page<WorkOrderSummary>> {
    return this.rows.list(actor, query);
  }

  exportRows(actor: Actor, query: WorkOrderExportQuery): Promise<WorkOrderSummary[]> {
    return this.rows.exportRows(actor, query);
  }

  async get(actor: Actor, workOrderId: string): Promise<WorkOrderView> {
    await this.deps.scope.requireWorkOrder(actor, workOrderId);
    return this.view(workOrderId);
  }

  accept(actor: Actor, workOrderId: string): Promise<WorkOrderView> {
    return this.asContractor(actor, workOrderId, async (ctx, wo) => {
      await this.deps.core.move(ctx, wo, 'accepted', { accepted_at: ctx.now });
    });
  }

  decline(actor: Actor, workOrderId: string, reason: string): Promise<WorkOrderView> {
    return this.asContractor(actor, workOrderId, async (ctx, wo) => {
      await this.deps.core.move(ctx, wo, 'declined', { declined_at: ctx.now, decline_reason: reason }, { reason });
      const passedTo = await this.passToBackup(ctx, wo);
      ctx.after.later(() => this.deps.core.deps.notifier.declined(wo.id, reason, passedTo));
    });
  }

  schedule(actor: Actor, workOrderId: string, visit: ScheduleRequest): Promise<WorkOrderView> {
    return this.asContractor(actor, workOrderId, async (ctx, wo) => {
      const window = { scheduled_start_at: new Date(visit.startAt), scheduled_end_at: new Date(visit.endAt) };
      await this.deps.core.move(ctx, wo, 'scheduled', window, { startAt: visit.startAt, endAt: visit.endAt });
      ctx.after.later(() => this.deps.core.deps.notifier.visitScheduled(wo.id));
    });
  }

  arrive(actor: Actor, workOrderId: string, notes: string): Promise<WorkOrderView> {
    return this.asContractor(actor, workOrderId, async (ctx, wo) => {
      await this.deps.core.move(ctx, wo, 'on-site');
      await ctx.db.query(`INSERT INTO work_order_visit (work_order_id, arrived_at, notes, technician_user_id) VALUES ($1, $2, $3, $4)`, [wo.id, ctx.now, notes, actor.id]);
    });
  }

  complete(actor: Actor, workOrderId: string, report: CompleteRequest): Promise<WorkOrderView> {
    return this.asContractor(actor, workOrderId, async (ctx, wo) => {
      const settings = await this.deps.settings.forOrganization(wo.organization_id);
      const dueAt = new Date(ctx.now.getTime() + settings.verificationWindowMinutes * MINUTE_MS);
      await this.deps.core.move(
        ctx,
        wo,
        'completed',
        {
          completed_at: ctx.now,
          cause_found: report.causeFound,
          cause_note: report.causeNote ?? null,
          findings: report.findings,
          ...(report.notes !== undefined ? { notes: report.notes } : {}),
          verification_due_at: dueAt,
          recovered_since: null,
          cost_status: 'pending',
        },
        { causeFound: report.causeFound },
      );
      await ctx.db.query(`UPDATE work_order_visit SET left_at = $2 WHERE work_order_id = $1 AND left_at IS NULL`, [wo.id, ctx.now]);
      const [request] = await ctx.db.query(`SELECT appliance_id FROM service_request WHERE id = $1`, [wo.service_request_id]);
      if (request?.appliance_id) this.deps.verification.watch(request.appliance_id);
      const hours = Math.round(settings.verificationWindowMinutes / 60);
      ctx.after.later(() => this.deps.core.deps.notifier.completed(wo.id, hours));
    });
  }

  update(actor: Actor, workOrderId: string, change: { findings?: string; notes?: string }): Promise<WorkOrderView> {
    return this.onWorkOrder(actor, workOrderId, async (ctx, wo) => {
      this.requireWorkable(wo);
      await this.deps.core.setColumns(ctx, wo.id, change);
      await recordChange(ctx.db, { workOrderId: wo.id, at: ctx.now, actor, type: 'notes-updated', detail: { fields: Object.keys(change) } });
    });
  }

  recordPart(actor: Actor, workOrderId: string, part: RecordPartRequest): Promise<WorkOrderView> {
    return this.asContractor(actor, workOrderId, async (ctx, wo) => {
      this.requireWorkable(wo);
      const [row] = await ctx.db.query(`SELECT currency FROM work_order WHERE id = $1`, [wo.id]);
      const currency = part.currency ?? row.currency;
      if (currency !== row.currency) throw conflict(`this work order is kept in ${row.currency}`);
      await ctx.db.query(
        `INSERT INTO work_order_part (work_order_id, name, quantity, unit_cost_cents, currency, recorded_by_user_id) VALUES ($1, $2, $3, $4, $5, $6)`,
        [wo.id, part.name, part.quantity, part.unitCostCents, currency, actor.id],
      );
      await recordChange(ctx.db, { workOrderId: wo.id, at: ctx.now, actor, type: 'part-recorded', detail: { name: part.name, quantity: part.quantity, unitCostCents: part.unitCostCents, currency } });
      this.deps.core.announce(ctx, wo.id, 'part-recorded');
    });
  }

  recordLabour(actor: Actor, workOrderId: string, labour: RecordLabourRequest): Promise<WorkOrderView> {
    return this.asContractor(actor, workOrderId, async (ctx, wo) => {
      this.requireWorkable(wo);
      await ctx.db.query(
        `INSERT INTO work_order_labour (work_order_id, minutes, hourly_rate_cents, currency, technician_user_id) SELECT $1, $2, $3, currency, $4 FROM work_order WHERE id = $1`,
        [wo.id, labour.minutes, labour.hourlyRateCents, actor.id],
      );
      await recordChange(ctx.db, { workOrderId: wo.id, at: ctx.now, actor, type: 'labour-recorded', detail: { ...labour } });
      this.deps.core.announce(ctx, wo.id, 'labour-recorded');
    });
  }

  approveCost(actor: Actor, workOrderId: string, note: string | undefined): Promise<WorkOrderView> {
    return this.decideCost(actor, workOrderId, 'approved', note ?? null);
  }

  disputeCost(actor: Actor, workOrderId: string, note: string): Promise<WorkOrderView> {
    return this.decideCost(actor, workOrderId, 'disputed', note);
  }

  /** For an appliance without telemetry after the repair: the manager confirms it by hand. */
  verifyByHand(actor: Actor, workOrderId: string, note: string | undefined): Promise<WorkOrderView> {
    return this.asManager(actor, workOrderId, async (ctx, wo) => {
      await this.deps.core.move(ctx, wo, 'verified', { verified_at: ctx.now }, { by: 'manager', note: note ?? null });
      await this.deps.core.closeRequest(ctx, wo.service_request_id, 'closed', 'repair confirmed by the manager', { firstVisitFix: wo.reopened_count === 0 });
    });
  }

  private decideCost(actor: Actor, workOrderId: string, decision: 'approved' | 'disputed', note: string | null): Promise<WorkOrderView> {
    return this.asManager(actor, workOrderId, async (ctx, wo) => {
      const [row] = await ctx.db.query(`SELECT cost_status FROM work_order WHERE id = $1`, [wo.id]);
      if (row.cost_status === 'none') throw conflict('the work order has no cost to decide yet: it is not completed');
      await this.deps.core.setColumns(ctx, wo.id, { cost_status: decision, cost_note: note, cost_decided_at: ctx.now, cost_decided_by_user_id: actor.id });
      await recordChange(ctx.db, { workOrderId: wo.id, at: ctx.now, actor, type: `cost-${decision}`, detail: { note } });
      this.deps.core.announce(ctx, wo.id, `cost-${decision}`);
    });
  }

  /** A declined auto-dispatched job goes to the backup contractor when there is a different one. */
  private async passToBackup(ctx: TxContext, wo: WorkOrderRow): Promise<string | null> {
    const [place] = await ctx.db.query(`SELECT r.property_id, a.style FROM service_request r LEFT JOIN appliance a ON a.id = r.appliance_id WHERE r.id = $1`, [wo.service_request_id]);
    const backup = await this.deps.core.deps.coverage.covering(ctx.db, place.property_id, place.style, 'backup');
    if (!backup || backup.contractorId === wo.contractor_id) return null;
    await this.deps.core.dispatch(ctx, wo.service_request_id, backup.contractorId, 'coverage-backup');
    return backup.name;
  }

  private requireWorkable(wo: WorkOrderRow): void {
    if (!isWorkable(wo.state)) throw conflict(`a work order that is ${wo.state} takes no more records`);
  }

  private asContractor(actor: Actor, workOrderId: string, work: (ctx: TxContext, wo: WorkOrderRow) => Promise<void>): Promise<WorkOrderView> {
    return this.onWorkOrder(actor, workOrderId, async (ctx, wo, place) => {
      if (!place.asContractor) throw forbidden('only the contractor doing the job records this');
      await work(ctx, wo);
    });
  }

  private asManager(actor: Actor, workOrderId: string, work: (ctx: TxContext, wo: WorkOrderRow) => Promise<void>): Promise<WorkOrderView> {
    return this.onWorkOrder(actor, workOrderId, async (ctx, wo, place) => {
      if (place.asContractor) throw forbidden('only a manager decides this');
      await work(ctx, wo);
    });
  }

  private async onWorkOrder(actor: Actor, workOrderId: string, work: (ctx: TxContext, wo: WorkOrderRow, place: WorkOrderPlace) => Promise<void>): Promise<WorkOrderView> {
    const after = new AfterCommit();
    await this.deps.dataSource.transaction(async (db) => {
      const place = await this.deps.scope.requireWorkOrder(actor, workOrderId, db);
      const ctx: TxContext = { db, now: this.deps.clock.now(), actor, after };
      await work(ctx, await this.deps.core.lockWorkOrder(ctx, workOrderId), place);
    });
    await after.run(this.deps.logger);
    return this.view(workOrderId);
  }

  private async view(workOrderId: string): Promise<WorkOrderView> {
    const view = await workOrderView(this.deps.dataSource, workOrderId, this.deps.clock.now().getTime());
    if (!view) throw notFound('work order');
    return view;
  }
}
