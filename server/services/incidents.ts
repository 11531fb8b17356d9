/** Incidents of the live monitor, for managers (their organization) and tenants (their unit). */
import type { DataSource } from 'typeorm';
import type { IncidentExportQuery, IncidentListItem, IncidentQuery, IncidentSort, IncidentView } from '../../shared/api/monitor';
import { EXPORT_MAX_ROWS, type IncidentColumn } from '../../shared/api/tables';
import type { Page } from '../../shared/api/users';
import { SEVERITIES } from '../../shared/domain';
import type { Actor } from '../auth/actor';
import { notFound } from '../errors';
import { assertExportable, isoCell, type ColumnValues } from '../exports/csv-export';
import { orderBy, rankOf, SqlFilters } from '../exports/sql-filters';
import { INCIDENT_COLUMNS, incidentViewOf } from '../monitor/views';
import { APPLIANCE_LABEL_SQL, placeOf } from '../work-orders/views';

const FROM = `incident i JOIN property p ON p.id = i.property_id LEFT JOIN unit u ON u.id = i.unit_id LEFT JOIN appliance a ON a.id = i.appliance_id`;
const PLACE_COLUMNS = `p.name AS property_name, p.time_zone AS property_time_zone, u.label AS unit_label, ${APPLIANCE_LABEL_SQL} AS appliance_label`;

const SORT_KEYS: Record<IncidentSort, string> = {
  openedAt: 'i.opened_at',
  startedAt: 'i.started_at',
  closedAt: 'i.closed_at',
  severity: rankOf('i.severity', SEVERITIES),
  kind: 'i.kind',
  property: 'p.name',
  unit: 'u.label',
  minutesAbove4c: 'i.minutes_above_4c',
};

/** What each CSV column holds. */
export const INCIDENT_CSV: ColumnValues<IncidentColumn, IncidentListItem> = {
  openedAt: (i) => isoCell(i.openedAt),
  property: (i) => i.place.propertyName,
  unit: (i) => i.place.unitLabel,
  appliance: (i) => i.place.applianceLabel,
  kind: (i) => i.kind,
  severity: (i) => i.severity,
  topCause: (i) => i.topCause,
  minutesAbove4c: (i) => i.minutesAbove4c,
  status: (i) => (i.closedAt ? 'closed' : 'open'),
  closedAt: (i) => isoCell(i.closedAt),
};

type IncidentFilters = Omit<IncidentQuery, 'page' | 'pageSize'>;

export class IncidentsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(actor: Actor, query: IncidentQuery): Promise<Page<IncidentListItem>> {
    const filters = this.filtersOf(actor, query);
    const total = await this.count(filters);
    const items = await this.rows(filters, query, query.pageSize, query.page * query.pageSize);
    return { items, total, page: query.page, pageSize: query.pageSize };
  }

  /** Every row the filters match, in the list's order; refused past the export cap. */
  async exportRows(actor: Actor, query: IncidentExportQuery): Promise<IncidentListItem[]> {
    const filters = this.filtersOf(actor, query);
    assertExportable(await this.count(filters));
    return this.rows(filters, query, EXPORT_MAX_ROWS, 0);
  }

  async get(actor: Actor, incidentId: string): Promise<IncidentView> {
    const [row] = await this.dataSource.query(`SELECT ${INCIDENT_COLUMNS} FROM incident i WHERE i.id = $1`, [incidentId]);
    const visible = row && (actor.role === 'manager' ? row.organization_id === actor.organizationId : !!actor.unitId && row.unit_id === actor.unitId);
    if (!visible) throw notFound('incident');
    return incidentViewOf(row);
  }

  private filtersOf(actor: Actor, query: IncidentFilters): SqlFilters {
    const filters = new SqlFilters();
    filters.add(actor.role === 'manager' ? `i.organization_id = ${filters.param(actor.organizationId)}` : `i.unit_id = ${filters.param(actor.unitId)}`);
    if (query.status === 'open') filters.add('i.closed_at IS NULL');
    if (query.status === 'closed') filters.add('i.closed_at IS NOT NULL');
    filters
      .when(query.applianceId, (p) => `i.appliance_id = ${p}`)
      .when(query.propertyId, (p) => `i.property_id = ${p}`)
      .when(query.severity, (p) => `i.severity = ${p}`)
      .when(query.kind, (p) => `i.kind = ${p}`)
      .when(query.cause, (p) => `i.top_cause = ${p}`)
      .range('i.opened_at', query.openedFrom, query.openedTo)
      .search(query.q, ['p.name', 'u.label', 'a.model', 'a.serial']);
    return filters;
  }

  private async count(filters: SqlFilters): Promise<number> {
    const [count] = await this.dataSource.query(`SELECT count(*)::int AS n FROM ${FROM} WHERE ${filters.where}`, filters.params);
    return count.n;
  }

  private async rows(filters: SqlFilters, query: IncidentFilters, limit: number, offset: number): Promise<IncidentListItem[]> {
    const order = orderBy(SORT_KEYS, query.sort, query.dir, 'i.opened_at DESC, i.id');
    const rows = await this.dataSource.query(`SELECT ${INCIDENT_COLUMNS}, ${PLACE_COLUMNS} FROM ${FROM} WHERE ${filters.where} ORDER BY ${order} LIMIT ${limit} OFFSET ${offset}`, filters.params);
    return rows.map((row: Record<string, unknown>) => ({ ...incidentViewOf(row), place: placeOf(row) }));
  }
}
