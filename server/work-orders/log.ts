/**
 * The record of every work-order change (who, when, from which state to which) and the
 * live events announcing it. Rows are written in the caller's transaction; events go out
 * after it committed (AfterCommit).
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { WorkOrderState } from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { EventBus } from '../events/bus';

type Db = DataSource | EntityManager;

export interface WorkOrderChange {
  workOrderId: string;
  at: Date;
  /** Null: the system (monitor, sweeper, verification). */
  actor: Actor | null;
  type: string;
  fromState?: WorkOrderState | null;
  toState?: WorkOrderState | null;
  detail?: Record<string, unknown>;
}

export async function recordChange(db: Db, change: WorkOrderChange): Promise<void> {
  await db.query(
    `INSERT INTO work_order_event (work_order_id, at, actor_user_id, actor_kind, type, from_state, to_state, detail) VALUES ($1, $2, $3, $4, $5, $6, $7, $8::jsonb)`,
    [change.workOrderId, change.at, change.actor?.id ?? null, change.actor ? 'user' : 'system', change.type, change.fromState ?? null, change.toState ?? null, JSON.stringify(change.detail ?? {})],
  );
}

export class LiveNotices {
  constructor(
    private readonly dataSource: DataSource,
    private readonly bus: EventBus,
  ) {}

  async workOrderChanged(workOrderId: string, change: string, atMs: number): Promise<void> {
    const [row] = await this.dataSource.query(
      `SELECT wo.id, wo.state, wo.contractor_id, r.id AS request_id, r.organization_id, r.property_id, r.unit_id, r.appliance_id
         FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id WHERE wo.id = $1`,
      [workOrderId],
    );
    if (!row) return;
    await this.bus.publish({
      type: 'work-order.changed',
      organizationId: row.organization_id,
      propertyId: row.property_id,
      unitId: row.unit_id,
      applianceId: row.appliance_id,
      atMs,
      workOrderId,
      serviceRequestId: row.request_id,
      contractorId: row.contractor_id,
      state: row.state,
      change,
    });
  }

  async requestChanged(requestId: string, change: string, atMs: number): Promise<void> {
    const [row] = await this.dataSource.query(`SELECT id, status, organization_id, property_id, unit_id, appliance_id FROM service_request WHERE id = $1`, [requestId]);
    if (!row) return;
    await this.bus.publish({
      type: 'service-request.changed',
      organizationId: row.organization_id,
      propertyId: row.property_id,
      unitId: row.unit_id,
      applianceId: row.appliance_id,
      atMs,
      serviceRequestId: requestId,
      status: row.status,
      change,
    });
  }
}
