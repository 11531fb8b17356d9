import type { DataSource, EntityManager } from 'typeorm';
import type { ApplianceView, ArchiveFilter, Page, UnitChange, UnitInput, UnitQuery, UnitView } from '../../shared/api/inventory';
import type { Actor } from '../auth/actor';
import { conflict, notFound } from '../errors';
import { APPLIANCE_SELECT, toApplianceView, type ApplianceRow } from './appliance-views';
import { archiveCondition, containsPattern, isoOrNull, isUniqueViolation, organizationOf } from './inventory-support';

/** Door labels sort as people read them: 2B before 10A. */
const NATURAL_LABEL = `NULLIF(substring(u.label from '^[0-9]+'), '')::bigint NULLS LAST, lower(u.label)`;

const SORT_COLUMNS: Record<UnitQuery['sort'], (direction: string) => string> = {
  label: (direction) => `NULLIF(substring(u.label from '^[0-9]+'), '')::bigint ${direction} ${direction === 'ASC' ? 'NULLS LAST' : 'NULLS FIRST'}, lower(u.label) ${direction}`,
  floor: (direction) => `u.floor ${direction} NULLS LAST, ${NATURAL_LABEL}`,
  createdAt: (direction) => `u.created_at ${direction}`,
};

interface UnitRow {
  id: string;
  property_id: string;
  label: string;
  floor: number | null;
  archived_at: Date | null;
  created_at: Date;
}

const UNIQUE_LABEL = 'unit_property_id_label_key';

function toView(row: UnitRow, appliances: ApplianceView[]): UnitView {
  return {
    id: row.id,
    propertyId: row.property_id,
    label: row.label,
    floor: row.floor,
    archivedAt: isoOrNull(row.archived_at),
    createdAt: row.created_at.toISOString(),
    appliances,
  };
}

/**
 * Units of the organization's properties. Archiving a unit archives its active appliances
 * and their sensors with the same timestamp; restoring brings back exactly those.
 */
export class UnitsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(actor: Actor, propertyId: string, query: UnitQuery): Promise<Page<UnitView>> {
    const organizationId = organizationOf(actor);
    await this.requireProperty(this.dataSource.manager, organizationId, propertyId);
    const params: unknown[] = [propertyId];
    let where = `u.property_id = $1 AND ${archiveCondition('u.archived_at', query.status)}`;
    if (query.q) {
      params.push(containsPattern(query.q));
      where += ` AND u.label ILIKE $2`;
    }
    const direction = query.direction === 'asc' ? 'ASC' : 'DESC';
    const [{ total }] = await this.dataSource.query(`SELECT count(*)::int AS total FROM unit u WHERE ${where}`, params);
    const rows: UnitRow[] = await this.dataSource.query(
      `SELECT u.id, u.property_id, u.label, u.floor, u.archived_at, u.created_at FROM unit u WHERE ${where}
       ORDER BY ${SORT_COLUMNS[query.sort](direction)}, u.id LIMIT ${query.pageSize} OFFSET ${query.page * query.pageSize}`,
      params,
    );
    const appliances = await this.appliancesOf(this.dataSource.manager, rows.map((row) => row.id), query.status);
    return { items: rows.map((row) => toView(row, appliances.get(row.id) ?? [])), total, page: query.page, pageSize: query.pageSize };
  }

  async get(actor: Actor, unitId: string): Promise<UnitView> {
    return this.view(this.dataSource.manager, organizationOf(actor), unitId);
  }

  async create(actor: Actor, propertyId: string, input: UnitInput): Promise<UnitView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const property = await this.requireProperty(manager, organizationId, propertyId);
      if (property.archived_at) throw conflict('the property is archived: restore it before adding units');
      const [row] = await this.uniqueLabel(input.label, () =>
        manager.query(`INSERT INTO unit (property_id, label, floor) VALUES ($1, $2, $3) RETURNING id`, [propertyId, input.label, input.floor ?? null]),
      );
      return this.view(manager, organizationId, row.id);
    });
  }

  async change(actor: Actor, unitId: string, change: UnitChange): Promise<UnitView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      await this.requireOwn(manager, organizationId, unitId);
      if (change.label !== undefined) {
        const label = change.label;
        await this.uniqueLabel(label, () => manager.query(`UPDATE unit SET label = $2 WHERE id = $1`, [unitId, label]));
      }
      if (change.floor !== undefined) await manager.query(`UPDATE unit SET floor = $2 WHERE id = $1`, [unitId, change.floor]);
      return this.view(manager, organizationId, unitId);
    });
  }

  async archive(actor: Actor, unitId: string): Promise<UnitView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const unit = await this.requireOwn(manager, organizationId, unitId);
      if (!unit.archived_at) {
        await manager.query(`UPDATE unit SET archived_at = now() WHERE id = $1`, [unitId]);
        await manager.query(`UPDATE appliance SET archived_at = now() WHERE unit_id = $1 AND archived_at IS NULL`, [unitId]);
        await manager.query(
          `UPDATE sensor s SET archived_at = now() FROM appliance a WHERE a.id = s.appliance_id AND a.unit_id = $1 AND s.archived_at IS NULL`,
          [unitId],
        );
      }
      return this.view(manager, organizationId, unitId);
    });
  }

  async restore(actor: Actor, unitId: string): Promise<UnitView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const unit = await this.requireOwn(manager, organizationId, unitId);
      if (unit.property_archived) throw conflict('the property is archived: restore the property first');
      if (unit.archived_at) {
        // Compared in SQL: the stored microseconds do not survive a round trip through a JS Date.
        const sameStamp = `(SELECT archived_at FROM unit WHERE id = $1)`;
        await manager.query(
          `UPDATE sensor s SET archived_at = NULL FROM appliance a WHERE a.id = s.appliance_id AND a.unit_id = $1 AND s.archived_at = ${sameStamp}`,
          [unitId],
        );
        await manager.query(`UPDATE appliance SET archived_at = NULL WHERE unit_id = $1 AND archived_at = ${sameStamp}`, [unitId]);
        await manager.query(`UPDATE unit SET archived_at = NULL WHERE id = $1`, [unitId]);
      }
      return this.view(manager, organizationId, unitId);
    });
  }

  private async view(manager: EntityManager, organizationId: string, unitId: string): Promise<UnitView> {
    const [row] = await manager.query(
      `SELECT u.id, u.property_id, u.label, u.floor, u.archived_at, u.created_at
         FROM unit u JOIN property p ON p.id = u.property_id WHERE u.id = $1 AND p.organization_id = $2`,
      [unitId, organizationId],
    );
    if (!row) throw notFound('unit');
    const appliances = await this.appliancesOf(manager, [unitId], row.archived_at ? 'all' : 'active');
    return toView(row, appliances.get(unitId) ?? []);
  }

  /** Active appliances for an active-only list, every appliance otherwise. */
  private async appliancesOf(manager: EntityManager, unitIds: string[], status: ArchiveFilter): Promise<Map<string, ApplianceView[]>> {
    const byUnit = new Map<string, ApplianceView[]>();
    if (!unitIds.length) return byUnit;
    const onlyActive = status === 'active' ? 'AND a.archived_at IS NULL' : '';
    const rows: ApplianceRow[] = await manager.query(`${APPLIANCE_SELECT} WHERE a.unit_id = ANY($1::uuid[]) ${onlyActive} ORDER BY a.created_at, a.id`, [unitIds]);
    for (const row of rows) {
      const list = byUnit.get(row.unit_id) ?? [];
      list.push(toApplianceView(row));
      byUnit.set(row.unit_id, list);
    }
    return byUnit;
  }

  private async requireProperty(manager: EntityManager, organizationId: string, propertyId: string): Promise<{ archived_at: Date | null }> {
    const [row] = await manager.query(`SELECT archived_at FROM property WHERE id = $1 AND organization_id = $2`, [propertyId, organizationId]);
    if (!row) throw notFound('property');
    return row;
  }

  private async requireOwn(manager: EntityManager, organizationId: string, unitId: string): Promise<{ archived_at: Date | null; property_archived: boolean }> {
    const [row] = await manager.query(
      `SELECT u.archived_at, p.archived_at IS NOT NULL AS property_archived
         FROM unit u JOIN property p ON p.id = u.property_id WHERE u.id = $1 AND p.organization_id = $2 FOR UPDATE OF u`,
      [unitId, organizationId],
    );
    if (!row) throw notFound('unit');
    return row;
  }

  private async uniqueLabel<T>(label: string, write: () => Promise<T>): Promise<T> {
    try {
      return await write();
    } catch (error) {
      if (isUniqueViolation(error, UNIQUE_LABEL)) throw conflict(`a unit labelled "${label}" already exists in this property (perhaps archived)`);
      throw error;
    }
  }
}
