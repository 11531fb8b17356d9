import type { DataSource, EntityManager } from 'typeorm';
import { warrantyBeforeInstall, type ApplianceChange, type ApplianceInput, type ApplianceQuery, type ApplianceView, type Page } from '../../shared/api/inventory';
import type { Actor } from '../auth/actor';
import { badRequest, conflict, notFound } from '../errors';
import { APPLIANCE_SELECT, toApplianceView, type ApplianceRow } from './appliance-views';
import { archiveCondition, containsPattern, organizationOf } from './inventory-support';

const NATURAL_LABEL = `NULLIF(substring(u.label from '^[0-9]+'), '')::bigint NULLS LAST, lower(u.label)`;

const SORT_COLUMNS: Record<ApplianceQuery['sort'], (direction: string) => string> = {
  property: (direction) => `lower(p.name) ${direction}, ${NATURAL_LABEL}`,
  unit: (direction) => `NULLIF(substring(u.label from '^[0-9]+'), '')::bigint ${direction} ${direction === 'ASC' ? 'NULLS LAST' : 'NULLS FIRST'}, lower(u.label) ${direction}, lower(p.name)`,
  style: (direction) => `a.style ${direction}, lower(p.name), ${NATURAL_LABEL}`,
  installedOn: (direction) => `a.installed_on ${direction} NULLS LAST`,
  createdAt: (direction) => `a.created_at ${direction}`,
};

const COLUMN_OF = {
  unitId: 'unit_id',
  style: 'style',
  model: 'model',
  serial: 'serial',
  installedOn: 'installed_on',
  warrantyEndsOn: 'warranty_ends_on',
} as const satisfies Record<keyof ApplianceChange, string>;

/** A date after today (UTC) cannot be an install date. */
function inFuture(isoDate: string | null | undefined): boolean {
  return !!isoDate && isoDate > new Date().toISOString().slice(0, 10);
}

/**
 * Appliances of the organization's units. Archiving one archives its sensor with the same
 * timestamp (the broker then refuses the sensor); restoring brings it back.
 */
export class ApplianceInventoryService {
  constructor(private readonly dataSource: DataSource) {}

  async list(actor: Actor, query: ApplianceQuery): Promise<Page<ApplianceView>> {
    const organizationId = organizationOf(actor);
    const params: unknown[] = [organizationId];
    const conditions = ['p.organization_id = $1', archiveCondition('a.archived_at', query.status)];
    if (query.propertyId) {
      params.push(query.propertyId);
      conditions.push(`p.id = $${params.length}`);
    }
    if (query.style) {
      params.push(query.style);
      conditions.push(`a.style = $${params.length}`);
    }
    if (query.q) {
      params.push(containsPattern(query.q));
      const n = params.length;
      conditions.push(`(a.model ILIKE $${n} OR a.serial ILIKE $${n} OR u.label ILIKE $${n} OR p.name ILIKE $${n} OR s.device_id ILIKE $${n})`);
    }
    const where = conditions.join(' AND ');
    const direction = query.direction === 'asc' ? 'ASC' : 'DESC';
    const [{ total }] = await this.dataSource.query(`SELECT count(*)::int AS total FROM (${APPLIANCE_SELECT} WHERE ${where}) matched`, params);
    const rows: ApplianceRow[] = await this.dataSource.query(
      `${APPLIANCE_SELECT} WHERE ${where} ORDER BY ${SORT_COLUMNS[query.sort](direction)}, a.id
       LIMIT ${query.pageSize} OFFSET ${query.page * query.pageSize}`,
      params,
    );
    return { items: rows.map(toApplianceView), total, page: query.page, pageSize: query.pageSize };
  }

  async get(actor: Actor, applianceId: string): Promise<ApplianceView> {
    return this.view(this.dataSource.manager, organizationOf(actor), applianceId);
  }

  async create(actor: Actor, input: ApplianceInput): Promise<ApplianceView> {
    const organizationId = organizationOf(actor);
    if (inFuture(input.installedOn)) throw badRequest('the install date is in the future');
    return this.dataSource.transaction(async (manager) => {
      await this.requireActiveUnit(manager, organizationId, input.unitId);
      const [row] = await manager.query(
        `INSERT INTO appliance (unit_id, style, model, serial, installed_on, warranty_ends_on) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
        [input.unitId, input.style, input.model, input.serial, input.installedOn ?? null, input.warrantyEndsOn ?? null],
      );
      return this.view(manager, organizationId, row.id);
    });
  }

  async change(actor: Actor, applianceId: string, change: ApplianceChange): Promise<ApplianceView> {
    const organizationId = organizationOf(actor);
    if (inFuture(change.installedOn)) throw badRequest('the install date is in the future');
    return this.dataSource.transaction(async (manager) => {
      const current = await this.view(manager, organizationId, applianceId, true);
      if (change.unitId && change.unitId !== current.unitId) await this.requireActiveUnit(manager, organizationId, change.unitId);
      const installedOn = change.installedOn !== undefined ? change.installedOn : current.installedOn;
      const warrantyEndsOn = change.warrantyEndsOn !== undefined ? change.warrantyEndsOn : current.warrantyEndsOn;
      if (warrantyBeforeInstall(installedOn, warrantyEndsOn)) throw badRequest('the warranty cannot end before the install date');
      const entries = (Object.keys(COLUMN_OF) as (keyof ApplianceChange)[]).filter((key) => change[key] !== undefined);
      const assignments = entries.map((key, index) => `${COLUMN_OF[key]} = $${index + 2}`);
      await manager.query(`UPDATE appliance SET ${assignments.join(', ')} WHERE id = $1`, [applianceId, ...entries.map((key) => change[key] ?? null)]);
      return this.view(manager, organizationId, applianceId);
    });
  }

  async archive(actor: Actor, applianceId: string): Promise<ApplianceView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const current = await this.view(manager, organizationId, applianceId, true);
      if (!current.archivedAt) {
        await manager.query(`UPDATE appliance SET archived_at = now() WHERE id = $1`, [applianceId]);
        await manager.query(`UPDATE sensor SET archived_at = now() WHERE appliance_id = $1 AND archived_at IS NULL`, [applianceId]);
      }
      return this.view(manager, organizationId, applianceId);
    });
  }

  async restore(actor: Actor, applianceId: string): Promise<ApplianceView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const current = await this.view(manager, organizationId, applianceId, true);
      if (current.archivedAt) {
        await this.requireActiveUnit(manager, organizationId, current.unitId, 'the unit is archived: restore the unit first');
        // Compared in SQL: the stored microseconds do not survive a round trip through a JS Date.
        await manager.query(`UPDATE sensor SET archived_at = NULL WHERE appliance_id = $1 AND archived_at = (SELECT archived_at FROM appliance WHERE id = $1)`, [applianceId]);
        await manager.query(`UPDATE appliance SET archived_at = NULL WHERE id = $1`, [applianceId]);
      }
      return this.view(manager, organizationId, applianceId);
    });
  }

  private async view(manager: EntityManager, organizationId: string, applianceId: string, lock = false): Promise<ApplianceView> {
    if (lock) await manager.query(`SELECT id FROM appliance WHERE id = $1 FOR UPDATE`, [applianceId]);
    const [row] = await manager.query(`${APPLIANCE_SELECT} WHERE a.id = $1 AND p.organization_id = $2`, [applianceId, organizationId]);
    if (!row) throw notFound('appliance');
    return toApplianceView(row);
  }

  private async requireActiveUnit(manager: EntityManager, organizationId: string, unitId: string, archivedMessage = 'the unit is archived'): Promise<void> {
    const [row] = await manager.query(
      `SELECT u.archived_at FROM unit u JOIN property p ON p.id = u.property_id WHERE u.id = $1 AND p.organization_id = $2`,
      [unitId, organizationId],
    );
    if (!row) throw notFound('unit');
    if (row.archived_at) throw conflict(archivedMessage);
  }
}
