/**
 * The timers of the loop, on the injected clock so specs can move time: escalation of an
 * unaccepted urgent job to the backup contractor, the overdue flag, incidents waiting out
 * their dispatch hold, and verification windows that ended without a reading.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { OPEN_WORK_ORDER_STATES } from '../../shared/api/work-orders';
import type { Clock } from '../auth/clock';
import { AfterCommit } from './after-commit';
import type { TxContext, WorkOrderCore, WorkOrderRow } from './core';
import { recordChange } from './log';
import type { OrgSettingsService } from './org-settings';
import type { RequestOpener } from './request-opening';
import type { Verification } from './verification';

export interface SweeperDeps {
  dataSource: DataSource;
  clock: Clock;
  core: WorkOrderCore;
  settings: OrgSettingsService;
  opener: RequestOpener;
  verification: Verification;
  logger: Logger;
}

export interface SweepReport {
  escalated: number;
  overdue: number;
  considered: number;
  reopened: number;
}

const MINUTE_MS = 60_000;

export class WorkOrderSweeper {
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<SweepReport> | null = null;

  constructor(private readonly deps: SweeperDeps) {}

  /** One pass of every timer; passes never overlap. */
  runOnce(): Promise<SweepReport> {
    this.running ??= this.sweep().finally(() => (this.running = null));
    return this.running;
  }

  start(intervalMs: number): void {
    this.timer = setInterval(() => {
      this.runOnce().catch((error) => this.deps.logger.error({ err: error }, 'work orders: sweep failed'));
    }, intervalMs);
    this.timer.unref();
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    await this.running;
  }

  private async sweep(): Promise<SweepReport> {
    const escalated = await this.escalate();
    const overdue = await this.flagOverdue();
    const pending = await this.deps.opener.pendingIncidentIds();
    for (const id of pending) await this.deps.opener.considerIncident(id);
    await this.deps.verification.refresh();
    const reopened = await this.deps.verification.expire();
    return { escalated, overdue, considered: pending.length, reopened };
  }

  private async inTx<T>(work: (ctx: TxContext) => Promise<T>): Promise<T> {
    const after = new AfterCommit();
    const result = await this.deps.dataSource.transaction((db) => work({ db, now: this.deps.clock.now(), actor: null, after }));
    await after.run(this.deps.logger);
    return result;
  }

  /** Urgent jobs still only dispatched after the organization's escalation time go to the backup. */
  private async escalate(): Promise<number> {
    const candidates: { id: string; organization_id: string; dispatched_at: Date }[] = await this.deps.dataSource.query(
      `SELECT id, organization_id, dispatched_at FROM work_order WHERE state = 'dispatched' AND priority = 'urgent' AND escalated_at IS NULL`,
    );
    let escalated = 0;
    const nowMs = this.deps.clock.now().getTime();
    for (const candidate of candidates) {
      const settings = await this.deps.settings.forOrganization(candidate.organization_id);
      if (nowMs - candidate.dispatched_at.getTime() < settings.escalateAfterMinutes * MINUTE_MS) continue;
      if (await this.inTx((ctx) => this.escalateOne(ctx, candidate.id, settings.escalateAfterMinutes))) escalated++;
    }
    return escalated;
  }

  private async escalateOne(ctx: TxContext, workOrderId: string, minutes: number): Promise<boolean> {
    const wo = await this.deps.core.lockWorkOrder(ctx, workOrderId);
    if (wo.state !== 'dispatched' || wo.escalated_at) return false;
    const [place] = await ctx.db.query(
      `SELECT r.property_id, a.style, c.name AS contractor_name FROM service_request r LEFT JOIN appliance a ON a.id = r.appliance_id
         JOIN contractor c ON c.id = $2 WHERE r.id = $1`,
      [wo.service_request_id, wo.contractor_id],
    );
    const backup = await this.deps.core.deps.coverage.covering(ctx.db, place.property_id, place.style, 'backup');
    if (!backup || backup.contractorId === wo.contractor_id) {
      await this.deps.core.setColumns(ctx, wo.id, { escalated_at: ctx.now });
      await recordChange(ctx.db, { workOrderId: wo.id, at: ctx.now, actor: null, type: 'escalation-failed', detail: { minutesUnaccepted: minutes, reason: 'no backup contractor covers this property and style' } });
      ctx.after.later(() => this.deps.core.deps.notifier.escalationWithoutBackup(wo.id, minutes));
      this.deps.core.announce(ctx, wo.id, 'escalation-failed');
      return true;
    }
    await this.reassign(ctx, wo, backup.contractorId, minutes);
    const fromName = place.contractor_name as string;
    ctx.after.later(() => this.deps.core.deps.notifier.escalatedToBackup(wo.id, minutes, fromName));
    return true;
  }

  /** The job passes to the backup; its acceptance clock restarts, its due time stays (the food's clock does not restart). */
  private async reassign(ctx: TxContext, wo: WorkOrderRow, backupId: string, minutes: number): Promise<void> {
    await this.deps.core.setColumns(ctx, wo.id, {
      contractor_id: backupId,
      escalated_from_contractor_id: wo.contractor_id,
      escalated_at: ctx.now,
      dispatched_at: ctx.now,
      dispatch_method: 'coverage-backup',
    });
    await recordChange(ctx.db, { workOrderId: wo.id, at: ctx.now, actor: null, type: 'escalated', detail: { from: wo.contractor_id, to: backupId, minutesUnaccepted: minutes } });
    this.deps.core.announce(ctx, wo.id, 'escalated');
  }

  private async flagOverdue(): Promise<number> {
    return this.inTx(async (ctx) => {
      const rows: { id: string; due_at: Date }[] = await ctx.db.query(
        `UPDATE work_order SET overdue_at = $1, updated_at = $1 WHERE state = ANY($2::text[]) AND due_at < $1 AND overdue_at IS NULL RETURNING id, due_at`,
        [ctx.now, OPEN_WORK_ORDER_STATES],
      ).then((result: [{ id: string; due_at: Date }[], number]) => result[0]);
      for (const row of rows) {
        await recordChange(ctx.db, { workOrderId: row.id, at: ctx.now, actor: null, type: 'overdue', detail: { dueAt: row.due_at.toISOString() } });
        this.deps.core.announce(ctx, row.id, 'overdue');
      }
      return rows.length;
    });
  }
}
