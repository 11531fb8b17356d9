/**
 * Verification from telemetry: after completion the monitor's levels of the appliance
 * are watched. When every compartment is back in its normal range (below its alarm limit
 * and within the recovered band of its own learned baseline, the engine's own notion of
 * recovered) and stays there for the hold time, the work order is verified and the
 * request closes. When the window ends first, the work order is reopened, the contractor
 * and the manager are told, and the request will not count as fixed on the first visit.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Probe } from '../../shared/domain';
import type { Clock } from '../auth/clock';
import { alarmLimitOf } from '../detection/context';
import { DEFAULT_SETTINGS, type DetectionSettings } from '../detection/settings';
import type { ApplianceStatusEvent, LevelPoint, ProbeLevelStatus } from '../events/internal';
import { AfterCommit } from './after-commit';
import type { TxContext, WorkOrderCore, WorkOrderRow } from './core';
import type { OrgSettingsService } from './org-settings';

export interface VerificationDeps {
  dataSource: DataSource;
  clock: Clock;
  core: WorkOrderCore;
  settings: OrgSettingsService;
  logger: Logger;
  detection?: DetectionSettings;
}

const MINUTE_MS = 60_000;

/** True when the probe's level is back in its normal range. */
export function probeRecovered(probe: Probe, levelC: number | null | undefined, baselineC: number | null | undefined, detection: DetectionSettings = DEFAULT_SETTINGS): boolean {
  if (levelC === null || levelC === undefined) return false;
  if (levelC > alarmLimitOf(probe, detection)) return false;
  return baselineC === null || baselineC === undefined || levelC <= baselineC + detection.recoveredBandC;
}

export interface Observation {
  atMs: number;
  recovered: boolean;
}

/**
 * What a status says about the cabinet after `sinceMs`, one observation per quarter-hour
 * level (the batch's whole trail), or only its latest level for a status without a trail.
 */
export function observationsOf(status: Pick<ApplianceStatusEvent, 'probes' | 'trail'>, sinceMs: number, detection: DetectionSettings = DEFAULT_SETTINGS): Observation[] {
  const probes = Object.keys(status.probes) as Probe[];
  if (!probes.length) return [];
  const baseline = (probe: Probe) => status.probes[probe]?.baselineC;
  const points: LevelPoint[] = status.trail ?? latestPoint(status.probes);
  return points
    .filter((point) => point.atMs > sinceMs)
    .map((point) => ({ atMs: point.atMs, recovered: probes.every((probe) => probeRecovered(probe, point.levelsC[probe], baseline(probe), detection)) }));
}

function latestPoint(probes: Partial<Record<Probe, ProbeLevelStatus>>): LevelPoint[] {
  const entries = Object.entries(probes) as [Probe, ProbeLevelStatus][];
  if (entries.some(([, level]) => level.levelAtMs === null)) return [];
  const atMs = Math.min(...entries.map(([, level]) => level.levelAtMs as number));
  return [{ atMs, levelsC: Object.fromEntries(entries.map(([probe, level]) => [probe, level.levelC])) }];
}

export type Verdict = { outcome: 'verified'; recoveredSinceMs: number; atMs: number } | { outcome: 'reopen' } | { outcome: 'waiting'; recoveredSinceMs: number | null };

/** Walks the observations in order: verified once recovered for the hold inside the window; reopened once past the window. */
export function judgeObservations(observations: Observation[], recoveredSinceMs: number | null, dueMs: number, holdMs: number, lastReadingAtMs: number): Verdict {
  let since = recoveredSinceMs;
  for (const observation of observations) {
    if (observation.atMs > dueMs) return { outcome: 'reopen' };
    since = observation.recovered ? (since ?? observation.atMs) : null;
    if (since !== null && observation.atMs - since >= holdMs) return { outcome: 'verified', recoveredSinceMs: since, atMs: observation.atMs };
  }
  return lastReadingAtMs > dueMs ? { outcome: 'reopen' } : { outcome: 'waiting', recoveredSinceMs: since };
}

export class Verification {
  /** Appliances with a completed work order awaiting verification (refreshed by the sweeper). */
  private awaiting = new Set<string>();

  constructor(private readonly deps: VerificationDeps) {}

  async refresh(): Promise<void> {
    const rows: { appliance_id: string }[] = await this.deps.dataSource.query(
      `SELECT DISTINCT r.appliance_id FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id WHERE wo.state = 'completed' AND r.appliance_id IS NOT NULL`,
    );
    this.awaiting = new Set(rows.map((row) => row.appliance_id));
  }

  watch(applianceId: string): void {
    this.awaiting.add(applianceId);
  }

  /** One appliance's status after a monitor batch. */
  async onStatus(status: ApplianceStatusEvent): Promise<void> {
    if (!this.awaiting.has(status.applianceId)) return;
    const rows: WorkOrderRow[] = await this.deps.dataSource.query(
      `SELECT wo.* FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id WHERE r.appliance_id = $1 AND wo.state = 'completed'`,
      [status.applianceId],
    );
    if (!rows.length) this.awaiting.delete(status.applianceId);
    for (const row of rows) await this.judge(row.id, status);
  }

  /** Completed work orders whose window passed by the clock (no reading came to decide it). */
  async expire(): Promise<number> {
    const rows: { id: string; has_telemetry: boolean }[] = await this.deps.dataSource.query(
      `SELECT wo.id, EXISTS (SELECT 1 FROM appliance_monitor m WHERE m.appliance_id = r.appliance_id AND m.last_reading_at > wo.completed_at) AS has_telemetry
         FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id
        WHERE wo.state = 'completed' AND wo.verification_due_at < $1`,
      [this.deps.clock.now()],
    );
    let reopened = 0;
    for (const row of rows) {
      if (row.has_telemetry) {
        await this.inTx((ctx) => this.withLocked(ctx, row.id, (wo) => this.reopen(ctx, wo)));
        reopened++;
      } else {
        await this.inTx((ctx) => this.withLocked(ctx, row.id, (wo) => this.noteUnverifiable(ctx, wo)));
      }
    }
    return reopened;
  }

  private async judge(workOrderId: string, status: ApplianceStatusEvent): Promise<void> {
    await this.inTx((ctx) =>
      this.withLocked(ctx, workOrderId, async (wo) => {
        const completedMs = (wo.completed_at as Date).getTime();
        const settings = await this.deps.settings.forOrganization(wo.organization_id);
        const dueMs = completedMs + settings.verificationWindowMinutes * MINUTE_MS;
        const observations = observationsOf(status, completedMs, this.deps.detection);
        const stored = wo.recovered_since?.getTime() ?? null;
        const verdict = judgeObservations(observations, stored, dueMs, settings.verificationHoldMinutes * MINUTE_MS, status.lastReadingAtMs);
        if (verdict.outcome === 'verified') return this.verify(ctx, wo, verdict.recoveredSinceMs, verdict.atMs);
        if (verdict.outcome === 'reopen') return this.reopen(ctx, wo);
        if (verdict.recoveredSinceMs !== stored) {
          await this.deps.core.setColumns(ctx, wo.id, { recovered_since: verdict.recoveredSinceMs === null ? null : new Date(verdict.recoveredSinceMs) });
        }
      }),
    );
  }

  private async verify(ctx: TxContext, wo: WorkOrderRow, recoveredSinceMs: number, levelMs: number): Promise<void> {
    await this.deps.core.move(ctx, wo, 'verified', { verified_at: ctx.now, recovered_since: new Date(recoveredSinceMs) }, {
      by: 'telemetry',
      recoveredSince: new Date(recoveredSinceMs).toISOString(),
      confirmedAt: new Date(levelMs).toISOString(),
    });
    await this.deps.core.closeRequest(ctx, wo.service_request_id, 'closed', 'repair verified from telemetry', { firstVisitFix: wo.reopened_count === 0 });
  }

  private async reopen(ctx: TxContext, wo: WorkOrderRow): Promise<void> {
    const settings = await this.deps.settings.forOrganization(wo.organization_id);
    await this.deps.core.move(ctx, wo, 'reopened', { reopened_count: wo.reopened_count + 1, recovered_since: null, verification_due_at: null }, {
      by: 'telemetry',
      reason: `not back in the normal range within ${settings.verificationWindowMinutes} minutes of completion`,
    });
    await ctx.db.query(`UPDATE service_request SET first_visit_fix = false, updated_at = $2 WHERE id = $1`, [wo.service_request_id, ctx.now]);
    const hours = Math.round(settings.verificationWindowMinutes / 60);
    ctx.after.later(() => this.deps.core.deps.notifier.reopened(wo.id, hours));
  }

  /** No reading since completion: a manager verifies by hand; noted once. */
  private async noteUnverifiable(ctx: TxContext, wo: WorkOrderRow): Promise<void> {
    const [seen] = await ctx.db.query(`SELECT 1 FROM work_order_event WHERE work_order_id = $1 AND type = 'verification-unavailable'`, [wo.id]);
    if (seen) return;
    await ctx.db.query(
      `INSERT INTO work_order_event (work_order_id, at, actor_kind, type, detail) VALUES ($1, $2, 'system', 'verification-unavailable', '{"reason":"no readings since completion"}'::jsonb)`,
      [wo.id, ctx.now],
    );
    this.deps.core.announce(ctx, wo.id, 'verification-unavailable');
  }

  private async withLocked(ctx: TxContext, workOrderId: string, work: (wo: WorkOrderRow) => Promise<void>): Promise<void> {
    const wo = await this.deps.core.lockWorkOrder(ctx, workOrderId);
    if (wo.state === 'completed') await work(wo);
  }

  private async inTx(work: (ctx: TxContext) => Promise<void>): Promise<void> {
    const after = new AfterCommit();
    await this.deps.dataSource.transaction((db) => work({ db, now: this.deps.clock.now(), actor: null, after }));
    await after.run(this.deps.logger);
  }
}
