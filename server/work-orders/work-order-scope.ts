/**
 * The scope rules of the brief, extended by work-order assignment: a contractor reaches
 * the unit and appliance of a job dispatched to their company for as long as the job
 * runs (until verified, declined or cancelled), and nothing else. Out of scope reads the
 * same as missing (404).
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { Actor } from '../auth/actor';
import { Scope, type Placement } from '../auth/scope';
import { notFound } from '../errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** SQL condition: the work order is still the contractor's business. */
export const LIVE_JOB = `wo.state NOT IN ('verified','declined','cancelled')`;

export interface RequestPlace {
  requestId: string;
  organizationId: string;
  propertyId: string;
  unitId: string | null;
  applianceId: string | null;
}

export interface WorkOrderPlace extends RequestPlace {
  workOrderId: string;
  contractorId: string;
  /** True when the actor reaches it as the contractor doing the job. */
  asContractor: boolean;
}

export class WorkOrderScope extends Scope {
  constructor(private readonly db: DataSource) {
    super(db);
  }

  /** The contractor companies a contractor user works for. */
  async contractorIdsOf(actor: Actor, db: DataSource | EntityManager = this.db): Promise<string[]> {
    if (actor.role !== 'contractor') return [];
    const rows: { contractor_id: string }[] = await db.query(
      `SELECT m.contractor_id FROM contractor_member m JOIN contractor c ON c.id = m.contractor_id WHERE m.user_id = $1 AND c.archived_at IS NULL`,
      [actor.id],
    );
    return rows.map((row) => row.contractor_id);
  }

  protected override async contractorReaches(actor: Actor, placement: Placement, applianceId?: string): Promise<boolean> {
    const [row] = await this.db.query(
      `SELECT 1 FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id JOIN contractor_member m ON m.contractor_id = wo.contractor_id
        WHERE m.user_id = $1 AND ${LIVE_JOB} AND r.unit_id = $2 AND ($3::uuid IS NULL OR r.appliance_id = $3) LIMIT 1`,
      [actor.id, placement.unitId, applianceId ?? null],
    );
    return !!row;
  }

  /** A request the actor may read: the manager's organization, the tenant's unit, or a contractor's job. */
  async requireRequest(actor: Actor, requestId: string, db: DataSource | EntityManager = this.db): Promise<RequestPlace> {
    const place = UUID.test(requestId) ? await this.requestPlace(db, requestId) : null;
    if (!place || !(await this.reachesRequest(actor, place, db))) throw notFound('service request');
    return place;
  }

  /** A request a manager of its organization acts on. */
  async requireManagedRequest(actor: Actor, requestId: string, db: DataSource | EntityManager = this.db): Promise<RequestPlace> {
    const place = UUID.test(requestId) ? await this.requestPlace(db, requestId) : null;
    if (!place || !this.manages(actor, place.organizationId)) throw notFound('service request');
    return place;
  }

  /** A work order the actor may read: the manager's organization or the contractor's company. */
  async requireWorkOrder(actor: Actor, workOrderId: string, db: DataSource | EntityManager = this.db): Promise<WorkOrderPlace> {
    const place = UUID.test(workOrderId) ? await this.workOrderPlace(db, workOrderId) : null;
    if (!place) throw notFound('work order');
    if (this.manages(actor, place.organizationId)) return { ...place, asContractor: false };
    if (actor.role === 'contractor' && (await this.contractorIdsOf(actor, db)).includes(place.contractorId)) return { ...place, asContractor: true };
    throw notFound('work order');
  }

  private async reachesRequest(actor: Actor, place: RequestPlace, db: DataSource | EntityManager): Promise<boolean> {
    if (actor.role === 'manager') return this.manages(actor, place.organizationId);
    if (actor.role === 'tenant') return !!actor.unitId && actor.unitId === place.unitId;
    const [row] = await db.query(
      `SELECT 1 FROM work_order wo JOIN contractor_member m ON m.contractor_id = wo.contractor_id WHERE wo.service_request_id = $1 AND m.user_id = $2 LIMIT 1`,
      [place.requestId, actor.id],
    );
    return !!row;
  }

  private async requestPlace(db: DataSource | EntityManager, requestId: string): Promise<RequestPlace | null> {
    const [row] = await db.query(`SELECT id, organization_id, property_id, unit_id, appliance_id FROM service_request WHERE id = $1`, [requestId]);
    return row ? { requestId: row.id, organizationId: row.organization_id, propertyId: row.property_id, unitId: row.unit_id, applianceId: row.appliance_id } : null;
  }

  private async workOrderPlace(db: DataSource | EntityManager, workOrderId: string): Promise<Omit<WorkOrderPlace, 'asContractor'> | null> {
    const [row] = await db.query(
      `SELECT wo.id, wo.contractor_id, r.id AS request_id, r.organization_id, r.property_id, r.unit_id, r.appliance_id
         FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id WHERE wo.id = $1`,
      [workOrderId],
    );
    if (!row) return null;
    return {
      workOrderId: row.id,
      contractorId: row.contractor_id,
      requestId: row.request_id,
      organizationId: row.organization_id,
      propertyId: row.property_id,
      unitId: row.unit_id,
      applianceId: row.appliance_id,
    };
  }
}
