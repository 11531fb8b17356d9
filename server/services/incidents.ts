/** Incidents of the live monitor, for managers (their organization) and tenants (their unit). */
import type { DataSource } from 'typeorm';
import type { IncidentQuery, IncidentView } from '../../shared/api/monitor';
import type { Page } from '../../shared/api/users';
import type { Actor } from '../auth/actor';
import { notFound } from '../errors';
import { INCIDENT_COLUMNS, incidentViewOf } from '../monitor/views';

export class IncidentsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(actor: Actor, query: IncidentQuery): Promise<Page<IncidentView>> {
    const params: unknown[] = [];
    const filters = [actor.role === 'manager' ? `i.organization_id = $${params.push(actor.organizationId)}` : `i.unit_id = $${params.push(actor.unitId)}`];
    if (query.status === 'open') filters.push('i.closed_at IS NULL');
    if (query.status === 'closed') filters.push('i.closed_at IS NOT NULL');
    if (query.applianceId) filters.push(`i.appliance_id = $${params.push(query.applianceId)}`);
    if (query.propertyId) filters.push(`i.property_id = $${params.push(query.propertyId)}`);
    const where = filters.join(' AND ');
    const [count] = await this.dataSource.query(`SELECT count(*)::int AS n FROM incident i WHERE ${where}`, params);
    const rows = await this.dataSource.query(
      `SELECT ${INCIDENT_COLUMNS} FROM incident i WHERE ${where} ORDER BY i.opened_at DESC, i.id LIMIT ${query.pageSize} OFFSET ${query.page * query.pageSize}`,
      params,
    );
    return { items: rows.map(incidentViewOf), total: count.n, page: query.page, pageSize: query.pageSize };
  }

  async get(actor: Actor, incidentId: string): Promise<IncidentView> {
    const [row] = await this.dataSource.query(`SELECT ${INCIDENT_COLUMNS} FROM incident i WHERE i.id = $1`, [incidentId]);
    const visible = row && (actor.role === 'manager' ? row.organization_id === actor.organizationId : !!actor.unitId && row.unit_id === actor.unitId);
    if (!visible) throw notFound('incident');
    return incidentViewOf(row);
  }
}
