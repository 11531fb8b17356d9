/**
 * The rules every path shares (monitor, tenant, manager, contractor, sweeper): dispatch,
 * state changes with their record, priority and due time, cancelling and closing. Each
 * method works inside the caller's transaction and queues its e-mails and live events
 * to run after the commit.
 */
import type { EntityManager } from 'typeorm';
import type { DispatchMethod, Priority, WorkOrderState } from '../../shared/api/work-orders';
import type { RequestStatus } from '../../shared/api/service-requests';
import type { Actor } from '../auth/actor';
import { conflict, notFound } from '../errors';
import type { CoverageService } from '../services/coverage';
import type { AfterCommit } from './after-commit';
import { recordChange, type LiveNotices } from './log';
import type { WorkOrderNotifier } from './notifier';
import type { OrgSettingsService } from './org-settings';
import { assertMove } from './states';
import { LIVE_JOB } from './work-order-scope';

export interface TxContext {
  db: EntityManager;
  now: Date;
  /** Null: the system. */
  actor: Actor | null;
  after: AfterCommit;
}

export interface CoreDeps {
  settings: OrgSettingsService;
  coverage: CoverageService;
  notifier: WorkOrderNotifier;
  live: LiveNotices;
}

export interface WorkOrderRow {
  id: string;
  organization_id: string;
  service_request_id: string;
  contractor_id: string;
  state: WorkOrderState;
  priority: Priority;
  dispatched_at: Date;
  due_at: Date;
  completed_at: Date | null;
  recovered_since: Date | null;
  reopened_count: number;
  escalated_at: Date | null;
}

const MINUTE_MS = 60_000;

export class WorkOrderCore {
  constructor(readonly deps: CoreDeps) {}

  /** Creates the request's work order for a contractor; 409 while another one is active. */
  async dispatch(ctx: TxContext, requestId: string, contractorId: string, method: DispatchMethod): Promise<string> {
    const [request] = await ctx.db.query(`SELECT id, organization_id, priority, status FROM service_request WHERE id = $1 FOR UPDATE`, [requestId]);
    if (!request) throw notFound('service request');
    if (request.status !== 'open') throw conflict(`the request is ${request.status}`);
    const [active] = await ctx.db.query(`SELECT id FROM work_order wo WHERE service_request_id = $1 AND ${LIVE_JOB}`, [requestId]);
    if (active) throw conflict('the request already has an active work order');
    const settings = await this.deps.settings.forOrganization(request.organization_id);
    const dueAt = new Date(ctx.now.getTime() + settings.responseMinutes[request.priority as Priority] * MINUTE_MS);
    const [row] = await ctx.db.query(
      `INSERT INTO work_order (organization_id, service_request_id, contractor_id, state, priority, dispatch_method, dispatched_at, due_at, currency, created_at, updated_at)
       VALUES ($1, $2, $3, 'dispatched', $4, $5, $6, $7, $8, $6, $6) RETURNING id`,
      [request.organization_id, requestId, contractorId, request.priority, method, ctx.now, dueAt, settings.currency],
    );
    const workOrderId = row.id as string;
    await recordChange(ctx.db, { workOrderId, at: ctx.now, actor: ctx.actor, type: 'dispatched', toState: 'dispatched', detail: { contractorId, method } });
    ctx.after.later(() => this.deps.notifier.dispatched(workOrderId));
    this.announce(ctx, workOrderId, 'dispatched');
    return workOrderId;
  }

  /** Dispatches to the covering contractor; null when nobody covers the property and style. */
  async dispatchByCoverage(ctx: TxContext, requestId: string): Promise<string | null> {
    const [request] = await ctx.db.query(
      `SELECT r.property_id, a.style FROM service_request r LEFT JOIN appliance a ON a.id = r.appliance_id WHERE r.id = $1`,
      [requestId],
    );
    const primary = await this.deps.coverage.covering(ctx.db, request.property_id, request.style, 'primary');
    if (primary) return this.dispatch(ctx, requestId, primary.contractorId, 'coverage-primary');
    const backup = await this.deps.coverage.covering(ctx.db, request.property_id, request.style, 'backup');
    return backup ? this.dispatch(ctx, requestId, backup.contractorId, 'coverage-backup') : null;
  }

  async lockWorkOrder(ctx: TxContext, workOrderId: string): Promise<WorkOrderRow> {
    const [row] = await ctx.db.query(`SELECT * FROM work_order WHERE id = $1 FOR UPDATE`, [workOrderId]);
    if (!row) throw notFound('work order');
    return row as WorkOrderRow;
  }

  /** Moves a work order to a state, sets the given columns, and records who did it. */
  async move(ctx: TxContext, workOrder: WorkOrderRow, to: WorkOrderState, columns: Record<string, unknown> = {}, detail: Record<string, unknown> = {}): Promise<void> {
    assertMove(workOrder.state, to);
    await this.setColumns(ctx, workOrder.id, { ...columns, state: to });
    await recordChange(ctx.db, { workOrderId: workOrder.id, at: ctx.now, actor: ctx.actor, type: to, fromState: workOrder.state, toState: to, detail });
    this.announce(ctx, workOrder.id, to);
    workOrder.state = to;
  }

  async setColumns(ctx: TxContext, workOrderId: string, columns: Record<string, unknown>): Promise<void> {
    const names = Object.keys(columns);
    const assignments = names.map((name, i) => `${name} = $${i + 2}`).join(', ');
    await ctx.db.query(`UPDATE work_order SET ${assignments}, updated_at = $${names.length + 2} WHERE id = $1`, [workOrderId, ...names.map((n) => columns[n]), ctx.now]);
  }

  /** Cancels the request's active work order, if any, and tells its contractor. */
  async cancelActive(ctx: TxContext, requestId: string, reason: string): Promise<void> {
    const [active] = await ctx.db.query(`SELECT * FROM work_order wo WHERE service_request_id = $1 AND ${LIVE_JOB} AND state <> 'completed' FOR UPDATE`, [requestId]);
    if (!active) return;
    await this.move(ctx, active as WorkOrderRow, 'cancelled', {}, { reason });
    ctx.after.later(() => this.deps.notifier.cancelled(active.id, reason));
  }

  async closeRequest(ctx: TxContext, requestId: string, status: Exclude<RequestStatus, 'open'>, reason: string, extra: { mergedIntoId?: string; firstVisitFix?: boolean } = {}): Promise<void> {
    await ctx.db.query(
      `UPDATE service_request SET status = $2, close_reason = $3, closed_at = $4, merged_into_id = coalesce($5, merged_into_id),
              first_visit_fix = coalesce($6, first_visit_fix), updated_at = $4 WHERE id = $1`,
      [requestId, status, reason, ctx.now, extra.mergedIntoId ?? null, extra.firstVisitFix ?? null],
    );
    this.announceRequest(ctx, requestId, status);
  }

  /** Sets the request's priority; its active work order follows, with its due time recomputed from dispatch. */
  async setPriority(ctx: TxContext, requestId: string, priority: Priority): Promise<void> {
    const [request] = await ctx.db.query(`SELECT organization_id, priority FROM service_request WHERE id = $1 FOR UPDATE`, [requestId]);
    if (!request || request.priority === priority) return;
    await ctx.db.query(`UPDATE service_request SET priority = $2, updated_at = $3 WHERE id = $1`, [requestId, priority, ctx.now]);
    this.announceRequest(ctx, requestId, 'priority');
    const [active] = await ctx.db.query(`SELECT * FROM work_order wo WHERE service_request_id = $1 AND ${LIVE_JOB} FOR UPDATE`, [requestId]);
    if (!active) return;
    const settings = await this.deps.settings.forOrganization(request.organization_id);
    const dueAt = new Date((active.dispatched_at as Date).getTime() + settings.responseMinutes[priority as Priority] * MINUTE_MS);
    await this.setColumns(ctx, active.id, { priority, due_at: dueAt });
    await recordChange(ctx.db, { workOrderId: active.id, at: ctx.now, actor: ctx.actor, type: 'reprioritised', detail: { from: active.priority, to: priority, dueAt: dueAt.toISOString() } });
    this.announce(ctx, active.id, 'reprioritised');
  }

  announce(ctx: TxContext, workOrderId: string, change: string): void {
    const atMs = ctx.now.getTime();
    ctx.after.later(() => this.deps.live.workOrderChanged(workOrderId, change, atMs));
  }

  announceRequest(ctx: TxContext, requestId: string, change: string): void {
    const atMs = ctx.now.getTime();
    ctx.after.later(() => this.deps.live.requestChanged(requestId, change, atMs));
  }
}
