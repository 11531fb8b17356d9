import type { DataSource, ObjectLiteral, SelectQueryBuilder } from 'typeorm';
import { notFound } from '../errors';
import type { Actor } from './actor';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Where a unit, and so its appliances, sits: the boundary every scope rule compares with. */
export interface Placement {
  unitId: string;
  propertyId: string;
  organizationId: string;
}

/**
 * The scope rules of the design brief, in one place:
 * - manager: everything of their own organization;
 * - tenant: their own unit and its appliances, nothing else (not even the property's other units);
 * - contractor: only what a work order dispatched to them covers, for the job's duration.
 *   Work orders arrive in a later issue; until then a contractor reaches no unit or appliance,
 *   and `contractorReaches` is the one method that issue extends.
 * Out of scope reads the same as missing: the `require…` helpers throw 404, so nobody
 * learns that a record of another organization exists.
 */
export class Scope {
  constructor(private readonly dataSource: DataSource) {}

  manages(actor: Actor, organizationId: string | null): boolean {
    return actor.role === 'manager' && !!actor.organizationId && actor.organizationId === organizationId;
  }

  async canReadUnit(actor: Actor, unitId: string): Promise<boolean> {
    const placement = await this.placementOfUnit(unitId);
    return placement !== null && (await this.reaches(actor, placement));
  }

  async canReadAppliance(actor: Actor, applianceId: string): Promise<boolean> {
    const placement = await this.placementOfAppliance(applianceId);
    return placement !== null && (await this.reaches(actor, placement, applianceId));
  }

  /** A property is a manager's business; tenants and contractors see only their unit or job. */
  async canReadProperty(actor: Actor, propertyId: string): Promise<boolean> {
    if (!UUID.test(propertyId)) return false;
    const [row] = await this.dataSource.query('SELECT organization_id FROM property WHERE id = $1', [propertyId]);
    return !!row && this.manages(actor, row.organization_id);
  }

  async requireUnit(actor: Actor, unitId: string): Promise<Placement> {
    const placement = await this.placementOfUnit(unitId);
    if (!placement || !(await this.reaches(actor, placement))) throw notFound('unit');
    return placement;
  }

  async requireAppliance(actor: Actor, applianceId: string): Promise<Placement> {
    const placement = await this.placementOfAppliance(applianceId);
    if (!placement || !(await this.reaches(actor, placement, applianceId))) throw notFound('appliance');
    return placement;
  }

  /** A unit a manager may assign people to: one of their organization's, not archived. */
  async requireManagedUnit(actor: Actor, unitId: string): Promise<Placement> {
    const placement = await this.placementOfUnit(unitId);
    if (!placement || !this.manages(actor, placement.organizationId)) throw notFound('unit');
    return placement;
  }

  /**
   * Narrows a query over units (aliases for the unit and its property) to what the actor
   * reaches, for list endpoints. Contractors get nothing until work orders exist.
   */
  restrictUnits<T extends ObjectLiteral>(query: SelectQueryBuilder<T>, actor: Actor, aliases: { unit: string; property: string }): SelectQueryBuilder<T> {
    if (actor.role === 'manager' && actor.organizationId) {
      return query.andWhere(`${aliases.property}.organization_id = :scopeOrganizationId`, { scopeOrganizationId: actor.organizationId });
    }
    if (actor.role === 'tenant' && actor.unitId) {
      return query.andWhere(`${aliases.unit}.id = :scopeUnitId`, { scopeUnitId: actor.unitId });
    }
    return query.andWhere('1 = 0');
  }

  private async reaches(actor: Actor, placement: Placement, applianceId?: string): Promise<boolean> {
    if (actor.role === 'manager') return this.manages(actor, placement.organizationId);
    if (actor.role === 'tenant') return !!actor.unitId && actor.unitId === placement.unitId;
    return this.contractorReaches(actor, placement, applianceId);
  }

  /** Extended by the work-order issue: true while an open work order dispatched to this contractor covers the unit. */
  protected async contractorReaches(_actor: Actor, _placement: Placement, _applianceId?: string): Promise<boolean> {
    return false;
  }

  private async placementOfUnit(unitId: string): Promise<Placement | null> {
    if (!UUID.test(unitId)) return null;
    const [row] = await this.dataSource.query(
      `SELECT u.id AS unit_id, u.property_id, p.organization_id
         FROM unit u JOIN property p ON p.id = u.property_id
        WHERE u.id = $1 AND u.archived_at IS NULL`,
      [unitId],
    );
    return row ? { unitId: row.unit_id, propertyId: row.property_id, organizationId: row.organization_id } : null;
  }

  private async placementOfAppliance(applianceId: string): Promise<Placement | null> {
    if (!UUID.test(applianceId)) return null;
    const [row] = await this.dataSource.query(
      `SELECT a.unit_id, u.property_id, p.organization_id
         FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
        WHERE a.id = $1`,
      [applianceId],
    );
    return row ? { unitId: row.unit_id, propertyId: row.property_id, organizationId: row.organization_id } : null;
  }
}
