import type { DataSource, EntityManager } from 'typeorm';
import type { Page, PropertyChange, PropertyInput, PropertyQuery, PropertyView } from '../../shared/api/inventory';
import type { Actor } from '../auth/actor';
import { conflict, notFound } from '../errors';
import { archiveCondition, containsPattern, isoOrNull, lockPropertyNames, organizationOf } from './inventory-support';

const SORT_COLUMNS: Record<PropertyQuery['sort'], string> = {
  name: 'lower(p.name)',
  city: 'lower(p.city)',
  createdAt: 'p.created_at',
};

/** Counts of what is active under each property, for the list and the detail header. */
const PROPERTY_SELECT = `
  SELECT p.id, p.name, p.address_line1, p.address_line2, p.city, p.region, p.postal_code, p.country,
         p.time_zone, p.archived_at, p.created_at,
         (SELECT count(*) FROM unit u WHERE u.property_id = p.id AND u.archived_at IS NULL)::int AS unit_count,
         (SELECT count(*) FROM appliance a JOIN unit u ON u.id = a.unit_id
           WHERE u.property_id = p.id AND a.archived_at IS NULL)::int AS appliance_count,
         (SELECT count(*) FROM sensor s JOIN appliance a ON a.id = s.appliance_id JOIN unit u ON u.id = a.unit_id
           WHERE u.property_id = p.id AND s.archived_at IS NULL)::int AS sensor_count
    FROM property p`;

interface PropertyRow {
  id: string;
  name: string;
  address_line1: string;
  address_line2: string | null;
  city: string;
  region: string;
  postal_code: string;
  country: string;
  time_zone: string;
  archived_at: Date | null;
  created_at: Date;
  unit_count: number;
  appliance_count: number;
  sensor_count: number;
}

function toView(row: PropertyRow): PropertyView {
  return {
    id: row.id,
    name: row.name,
    addressLine1: row.address_line1,
    addressLine2: row.address_line2,
    city: row.city,
    region: row.region,
    postalCode: row.postal_code,
    country: row.country,
    timeZone: row.time_zone,
    archivedAt: isoOrNull(row.archived_at),
    createdAt: row.created_at.toISOString(),
    unitCount: row.unit_count,
    applianceCount: row.appliance_count,
    sensorCount: row.sensor_count,
  };
}

const COLUMN_OF: Record<keyof PropertyChange, string> = {
  name: 'name',
  addressLine1: 'address_line1',
  addressLine2: 'address_line2',
  city: 'city',
  region: 'region',
  postalCode: 'postal_code',
  country: 'country',
  timeZone: 'time_zone',
};

/**
 * Properties of the manager's organization. Archiving a property archives its active units,
 * appliances and sensors with the same timestamp, so restoring brings back exactly those.
 */
export class PropertiesService {
  constructor(private readonly dataSource: DataSource) {}

  async list(actor: Actor, query: PropertyQuery): Promise<Page<PropertyView>> {
    const organizationId = organizationOf(actor);
    const params: unknown[] = [organizationId];
    let where = `p.organization_id = $1 AND ${archiveCondition('p.archived_at', query.status)}`;
    if (query.q) {
      params.push(containsPattern(query.q));
      where += ` AND (p.name ILIKE $2 OR p.address_line1 ILIKE $2 OR p.city ILIKE $2)`;
    }
    const direction = query.direction === 'asc' ? 'ASC' : 'DESC';
    const [{ total }] = await this.dataSource.query(`SELECT count(*)::int AS total FROM property p WHERE ${where}`, params);
    const rows: PropertyRow[] = await this.dataSource.query(
      `${PROPERTY_SELECT} WHERE ${where} ORDER BY ${SORT_COLUMNS[query.sort]} ${direction}, p.id
       LIMIT ${query.pageSize} OFFSET ${query.page * query.pageSize}`,
      params,
    );
    return { items: rows.map(toView), total, page: query.page, pageSize: query.pageSize };
  }

  async get(actor: Actor, propertyId: string): Promise<PropertyView> {
    return this.view(this.dataSource.manager, organizationOf(actor), propertyId);
  }

  async create(actor: Actor, input: PropertyInput): Promise<PropertyView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      await this.ensureNameFree(manager, organizationId, input.name, null);
      const [row] = await manager.query(
        `INSERT INTO property (organization_id, name, address_line1, address_line2, city, region, postal_code, country, time_zone)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9) RETURNING id`,
        [organizationId, input.name, input.addressLine1, input.addressLine2 ?? null, input.city, input.region, input.postalCode, input.country, input.timeZone],
      );
      return this.view(manager, organizationId, row.id);
    });
  }

  async change(actor: Actor, propertyId: string, change: PropertyChange): Promise<PropertyView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      await this.requireOwn(manager, organizationId, propertyId);
      if (change.name !== undefined) await this.ensureNameFree(manager, organizationId, change.name, propertyId);
      const entries = Object.entries(change).filter(([, value]) => value !== undefined) as [keyof PropertyChange, unknown][];
      const assignments = entries.map(([key], index) => `${COLUMN_OF[key]} = $${index + 2}`);
      await manager.query(`UPDATE property SET ${assignments.join(', ')} WHERE id = $1`, [propertyId, ...entries.map(([key, value]) => (key === 'addressLine2' ? (value ?? null) : value))]);
      return this.view(manager, organizationId, propertyId);
    });
  }

  async archive(actor: Actor, propertyId: string): Promise<PropertyView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const current = await this.requireOwn(manager, organizationId, propertyId);
      if (current.archived_at) return this.view(manager, organizationId, propertyId);
      // now() is the transaction's start time: one timestamp for the property and everything under it.
      await manager.query(`UPDATE property SET archived_at = now() WHERE id = $1`, [propertyId]);
      await manager.query(`UPDATE unit SET archived_at = now() WHERE property_id = $1 AND archived_at IS NULL`, [propertyId]);
      await manager.query(
        `UPDATE appliance a SET archived_at = now() FROM unit u WHERE u.id = a.unit_id AND u.property_id = $1 AND a.archived_at IS NULL`,
        [propertyId],
      );
      await manager.query(
        `UPDATE sensor s SET archived_at = now() FROM appliance a JOIN unit u ON u.id = a.unit_id
          WHERE a.id = s.appliance_id AND u.property_id = $1 AND s.archived_at IS NULL`,
        [propertyId],
      );
      return this.view(manager, organizationId, propertyId);
    });
  }

  async restore(actor: Actor, propertyId: string): Promise<PropertyView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const current = await this.requireOwn(manager, organizationId, propertyId);
      if (!current.archived_at) return this.view(manager, organizationId, propertyId);
      await this.ensureNameFree(manager, organizationId, current.name, propertyId);
      // Compared in SQL: the stored microseconds do not survive a round trip through a JS Date.
      const sameStamp = `(SELECT archived_at FROM property WHERE id = $1)`;
      await manager.query(
        `UPDATE sensor s SET archived_at = NULL FROM appliance a JOIN unit u ON u.id = a.unit_id
          WHERE a.id = s.appliance_id AND u.property_id = $1 AND s.archived_at = ${sameStamp}`,
        [propertyId],
      );
      await manager.query(
        `UPDATE appliance a SET archived_at = NULL FROM unit u WHERE u.id = a.unit_id AND u.property_id = $1 AND a.archived_at = ${sameStamp}`,
        [propertyId],
      );
      await manager.query(`UPDATE unit SET archived_at = NULL WHERE property_id = $1 AND archived_at = ${sameStamp}`, [propertyId]);
      await manager.query(`UPDATE property SET archived_at = NULL WHERE id = $1`, [propertyId]);
      return this.view(manager, organizationId, propertyId);
    });
  }

  private async view(manager: EntityManager, organizationId: string, propertyId: string): Promise<PropertyView> {
    const [row] = await manager.query(`${PROPERTY_SELECT} WHERE p.id = $1 AND p.organization_id = $2`, [propertyId, organizationId]);
    if (!row) throw notFound('property');
    return toView(row);
  }

  /** The property's row if it belongs to the organization, locked for the change; 404 otherwise. */
  private async requireOwn(manager: EntityManager, organizationId: string, propertyId: string): Promise<{ name: string; archived_at: Date | null }> {
    const [row] = await manager.query(`SELECT name, archived_at FROM property WHERE id = $1 AND organization_id = $2 FOR UPDATE`, [propertyId, organizationId]);
    if (!row) throw notFound('property');
    return row;
  }

  /** Active property names are unique in an organization (case-insensitive): the CSV import matches on them. */
  private async ensureNameFree(manager: EntityManager, organizationId: string, name: string, exceptId: string | null): Promise<void> {
    await lockPropertyNames(manager, organizationId);
    const [row] = await manager.query(
      `SELECT id FROM property WHERE organization_id = $1 AND lower(name) = lower($2) AND archived_at IS NULL AND ($3::uuid IS NULL OR id <> $3)`,
      [organizationId, name, exceptId],
    );
    if (row) throw conflict(`a property named "${name}" already exists`);
  }
}
