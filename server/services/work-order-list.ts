/**
 * The work-order list behind the manager's table and the contractor's job list: reach by
 * role, status and the other filters, whitelisted sorting, paging, and the CSV rows.
 */
import type { DataSource } from 'typeorm';
import { EXPORT_MAX_ROWS, type WorkOrderColumn } from '../../shared/api/tables';
import type { Page } from '../../shared/api/users';
import { WORK_ORDER_STATES, type WorkOrderExportQuery, type WorkOrderQuery, type WorkOrderSort, type WorkOrderSummary } from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { assertExportable, isoCell, type ColumnValues } from '../exports/csv-export';
import { orderBy, rankOf, SqlFilters } from '../exports/sql-filters';
import { WORK_ORDER_FROM, workOrderSummaries } from '../work-orders/views';
import type { WorkOrderScope } from '../work-orders/work-order-scope';

const OPEN = `wo.state IN ('dispatched','accepted','scheduled','on-site','reopened')`;

/** `now` adds the current time as a parameter, only for the status that needs it. */
const STATUS_FILTERS: Record<WorkOrderQuery['status'], (now: () => string) => string> = {
  open: () => OPEN,
  overdue: (now) => `${OPEN} AND wo.due_at < ${now()}`,
  completed: () => `wo.state IN ('completed','verified')`,
  all: () => 'true',
};

const SORT_KEYS: Record<WorkOrderSort, string> = {
  dueAt: 'wo.due_at',
  dispatchedAt: 'wo.dispatched_at',
  state: rankOf('wo.state', WORK_ORDER_STATES),
  priority: rankOf('wo.priority', ['routine', 'urgent']),
  contractor: 'c.name',
  property: 'p.name',
  unit: 'u.label',
  title: 'lower(r.title)',
};

/** What each CSV column holds. */
export const WORK_ORDER_CSV: ColumnValues<WorkOrderColumn, WorkOrderSummary> = {
  dueAt: (w) => isoCell(w.dueAt),
  title: (w) => w.title,
  property: (w) => w.property.name,
  unit: (w) => w.unit?.label,
  contractor: (w) => w.contractor.name,
  priority: (w) => w.priority,
  state: (w) => w.state,
  overdue: (w) => (w.overdue ? 'yes' : 'no'),
  dispatchedAt: (w) => isoCell(w.dispatchedAt),
  scheduledStartAt: (w) => isoCell(w.scheduledStartAt),
};

type Filters = Omit<WorkOrderQuery, 'page' | 'pageSize'>;

export class WorkOrderList {
  constructor(private readonly deps: { dataSource: DataSource; clock: Clock; scope: WorkOrderScope }) {}

  async list(actor: Actor, query: WorkOrderQuery): Promise<Page<WorkOrderSummary>> {
    const now = this.deps.clock.now();
    const filters = await this.filtersOf(actor, query, now);
    const total = await this.count(filters);
    const items = await this.rows(filters, query, now, { limit: query.pageSize, offset: query.page * query.pageSize });
    return { items, total, page: query.page, pageSize: query.pageSize };
  }

  /** Every work order the filters match, in the list's order; refused past the export cap. */
  async exportRows(actor: Actor, query: WorkOrderExportQuery): Promise<WorkOrderSummary[]> {
    const now = this.deps.clock.now();
    const filters = await this.filtersOf(actor, query, now);
    assertExportable(await this.count(filters));
    return this.rows(filters, query, now, { limit: EXPORT_MAX_ROWS, offset: 0 });
  }

  private async filtersOf(actor: Actor, query: Filters, now: Date): Promise<SqlFilters> {
    const filters = new SqlFilters();
    if (actor.role === 'manager') filters.add(`wo.organization_id = ${filters.param(actor.organizationId)}`);
    else filters.add(`wo.contractor_id = ANY(${filters.param(await this.deps.scope.contractorIdsOf(actor))}::uuid[])`);
    filters.add(STATUS_FILTERS[query.status](() => `${filters.param(now)}::timestamptz`));
    return filters
      .when(query.state, (p) => `wo.state = ${p}`)
      .when(query.propertyId, (p) => `r.property_id = ${p}`)
      .when(query.serviceRequestId, (p) => `wo.service_request_id = ${p}`)
      .when(query.priority, (p) => `wo.priority = ${p}`)
      .range('wo.dispatched_at', query.openedFrom, query.openedTo)
      .search(query.q, ['r.title', 'p.name', 'u.label', 'c.name']);
  }

  private async count(filters: SqlFilters): Promise<number> {
    const [count] = await this.deps.dataSource.query(`SELECT count(*)::int AS n FROM ${WORK_ORDER_FROM} WHERE ${filters.where}`, filters.params);
    return count.n;
  }

  private rows(filters: SqlFilters, query: Filters, now: Date, page: { limit: number; offset: number }): Promise<WorkOrderSummary[]> {
    const order = orderBy(SORT_KEYS, query.sort, query.dir, 'wo.due_at, wo.id');
    return workOrderSummaries(this.deps.dataSource, filters.where, filters.params, now.getTime(), page, order);
  }
}
