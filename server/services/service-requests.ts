/**
 * Service requests as people work them: managers open, dispatch, merge, cancel (with a
 * reason) and reprioritise; tenants read their unit's requests; contractors read the
 * requests behind their jobs. The monitor's own path is work-orders/request-opening.ts.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { CreateServiceRequest, RequestSort, ServiceRequestExportQuery, ServiceRequestQuery, ServiceRequestView } from '../../shared/api/service-requests';
import { EXPORT_MAX_ROWS, type RequestColumn } from '../../shared/api/tables';
import type { Page } from '../../shared/api/users';
import type { Priority } from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { badRequest, conflict, notFound } from '../errors';
import { AfterCommit } from '../work-orders/after-commit';
import type { TxContext, WorkOrderCore } from '../work-orders/core';
import { assertExportable, isoCell, type ColumnValues } from '../exports/csv-export';
import { orderBy, rankOf, SqlFilters } from '../exports/sql-filters';
import { MERGED_SYMPTOMS, REQUEST_FROM, requestViews } from '../work-orders/views';
import { LIVE_JOB, type WorkOrderScope } from '../work-orders/work-order-scope';

const REQUEST_SORT_KEYS: Record<RequestSort, string> = {
  openedAt: 'r.opened_at',
  closedAt: 'r.closed_at',
  priority: rankOf('r.priority', ['routine', 'urgent']),
  status: 'r.status',
  title: 'lower(r.title)',
  property: 'p.name',
  unit: 'u.label',
};

/** SQL: the names of every contractor a job of the request went to, for the free-text search. */
const CONTRACTOR_NAMES = `(SELECT string_agg(c2.name, ' ') FROM work_order w2 JOIN contractor c2 ON c2.id = w2.contractor_id WHERE w2.service_request_id = r.id)`;

/** What each CSV column holds. */
export const REQUEST_CSV: ColumnValues<RequestColumn, ServiceRequestView> = {
  openedAt: (r) => isoCell(r.openedAt),
  title: (r) => r.title,
  property: (r) => r.place.propertyName,
  unit: (r) => r.place.unitLabel,
  appliance: (r) => r.place.applianceLabel,
  source: (r) => r.source,
  priority: (r) => r.priority,
  status: (r) => r.status,
  progress: (r) => r.progress,
  contractor: (r) => r.workOrder?.contractorName ?? '',
  closedAt: (r) => isoCell(r.closedAt),
};

export interface ServiceRequestsDeps {
  dataSource: DataSource;
  clock: Clock;
  scope: WorkOrderScope;
  core: WorkOrderCore;
  logger: Logger;
}

export class ServiceRequestsService {
  constructor(private readonly deps: ServiceRequestsDeps) {}

  async list(actor: Actor, query: ServiceRequestQuery): Promise<Page<ServiceRequestView>> {
    const filters = await this.filtersOf(actor, query);
    const total = await this.count(filters);
    const order = orderBy(REQUEST_SORT_KEYS, query.sort, query.dir, 'r.opened_at DESC, r.id');
    const items = await requestViews(this.deps.dataSource, filters.where, filters.params, { limit: query.pageSize, offset: query.page * query.pageSize }, order);
    return { items, total, page: query.page, pageSize: query.pageSize };
  }

  /** Every request the filters match, in the list's order; refused past the export cap. */
  async exportRows(actor: Actor, query: ServiceRequestExportQuery): Promise<ServiceRequestView[]> {
    const filters = await this.filtersOf(actor, query);
    assertExportable(await this.count(filters));
    const order = orderBy(REQUEST_SORT_KEYS, query.sort, query.dir, 'r.opened_at DESC, r.id');
    return requestViews(this.deps.dataSource, filters.where, filters.params, { limit: EXPORT_MAX_ROWS, offset: 0 }, order);
  }

  private async filtersOf(actor: Actor, query: Omit<ServiceRequestQuery, 'page' | 'pageSize'>): Promise<SqlFilters> {
    const { where, params } = await this.reach(actor);
    const filters = new SqlFilters(params).add(where);
    if (query.status !== 'all') filters.add(`r.status = ${filters.param(query.status)}`);
    filters
      .when(query.propertyId, (p) => `r.property_id = ${p}`)
      .when(query.applianceId, (p) => `r.appliance_id = ${p}`)
      .when(query.priority, (p) => `r.priority = ${p}`)
      .when(query.source, (p) => `r.source = ${p}`)
      .when(query.cause, (p) => `EXISTS (SELECT 1 FROM incident ci WHERE ci.id = r.incident_id AND ci.top_cause = ${p})`)
      .range('r.opened_at', query.openedFrom, query.openedTo)
      .search(query.q, ['r.title', 'p.name', 'u.label', 'a.model', 'a.serial', CONTRACTOR_NAMES]);
    return filters;
  }

  private async count(filters: SqlFilters): Promise<number> {
    const [count] = await this.deps.dataSource.query(`SELECT count(*)::int AS n FROM ${REQUEST_FROM} WHERE ${filters.where}`, filters.params);
    return count.n;
  }

  async get(actor: Actor, requestId: string): Promise<ServiceRequestView> {
    await this.deps.scope.requireRequest(actor, requestId);
    return this.view(requestId);
  }

  async create(actor: Actor, request: CreateServiceRequest): Promise<ServiceRequestView> {
    const placement = await this.deps.scope.requireAppliance(actor, request.applianceId);
    if (placement.organizationId !== actor.organizationId) throw notFound('appliance');
    const id = await this.inTx(actor, async (ctx) => {
      await ctx.db.query(`SELECT id FROM appliance WHERE id = $1 FOR UPDATE`, [request.applianceId]);
      const [open] = await ctx.db.query(`SELECT id FROM service_request WHERE appliance_id = $1 AND status = 'open'`, [request.applianceId]);
      if (open) throw conflict(`this appliance already has an open request (${open.id}): add to it instead`);
      const [row] = await ctx.db.query(
        `INSERT INTO service_request (organization_id, property_id, unit_id, appliance_id, level, source, priority, title, description, opened_by_user_id, opened_at, updated_at)
         VALUES ($1, $2, $3, $4, 'appliance', 'manager', $5, $6, $7, $8, $9, $9) RETURNING id`,
        [placement.organizationId, placement.propertyId, placement.unitId, request.applianceId, request.priority, request.title, request.description, actor.id, ctx.now],
      );
      this.deps.core.announceRequest(ctx, row.id, 'opened');
      return row.id as string;
    });
    return this.view(id);
  }

  /** To the given contractor of the organization, or else to the one covering the property and style. */
  async dispatch(actor: Actor, requestId: string, contractorId: string | undefined): Promise<ServiceRequestView> {
    await this.deps.scope.requireManagedRequest(actor, requestId);
    await this.inTx(actor, async (ctx) => {
      if (contractorId) {
        const [contractor] = await ctx.db.query(`SELECT id FROM contractor WHERE id = $1 AND organization_id = $2 AND archived_at IS NULL`, [contractorId, actor.organizationId]);
        if (!contractor) throw notFound('contractor');
        await this.deps.core.dispatch(ctx, requestId, contractorId, 'manual');
        return;
      }
      const dispatched = await this.deps.core.dispatchByCoverage(ctx, requestId);
      if (!dispatched) throw conflict('no contractor covers this property and appliance style: choose one');
    });
    return this.view(requestId);
  }

  async cancel(actor: Actor, requestId: string, reason: string): Promise<ServiceRequestView> {
    await this.deps.scope.requireManagedRequest(actor, requestId);
    await this.inTx(actor, async (ctx) => {
      await this.requireOpen(ctx, requestId);
      await this.deps.core.cancelActive(ctx, requestId, reason);
      await this.deps.core.closeRequest(ctx, requestId, 'cancelled', reason);
    });
    return this.view(requestId);
  }

  /** Folds one request into another of the same property: its reports and symptoms move, its job is cancelled. */
  async merge(actor: Actor, requestId: string, intoRequestId: string): Promise<ServiceRequestView> {
    if (requestId === intoRequestId) throw badRequest('a request cannot be merged into itself');
    const source = await this.deps.scope.requireManagedRequest(actor, requestId);
    const target = await this.deps.scope.requireManagedRequest(actor, intoRequestId);
    if (source.propertyId !== target.propertyId) throw badRequest('only requests of the same property can be merged');
    await this.inTx(actor, async (ctx) => {
      await this.requireOpen(ctx, requestId);
      await this.requireOpen(ctx, intoRequestId);
      await ctx.db.query(`UPDATE tenant_report SET service_request_id = $2 WHERE service_request_id = $1`, [requestId, intoRequestId]);
      await ctx.db.query(
        `UPDATE service_request t SET symptoms = ${MERGED_SYMPTOMS('t.symptoms', 's.symptoms')}, updated_at = $3 FROM service_request s WHERE t.id = $2 AND s.id = $1`,
        [requestId, intoRequestId, ctx.now],
      );
      const [sourcePriority] = await ctx.db.query(`SELECT priority FROM service_request WHERE id = $1`, [requestId]);
      if (sourcePriority.priority === 'urgent') await this.deps.core.setPriority(ctx, intoRequestId, 'urgent');
      await this.deps.core.cancelActive(ctx, requestId, 'merged into another request');
      await this.deps.core.closeRequest(ctx, requestId, 'merged', 'merged by a manager', { mergedIntoId: intoRequestId });
    });
    return this.view(intoRequestId);
  }

  async reprioritise(actor: Actor, requestId: string, priority: Priority): Promise<ServiceRequestView> {
    await this.deps.scope.requireManagedRequest(actor, requestId);
    await this.inTx(actor, async (ctx) => {
      await this.requireOpen(ctx, requestId);
      await this.deps.core.setPriority(ctx, requestId, priority);
    });
    return this.view(requestId);
  }

  /** Requests of the actor's reach as a condition over alias r. */
  private async reach(actor: Actor): Promise<{ where: string; params: unknown[] }> {
    if (actor.role === 'manager') return { where: 'r.organization_id = $1', params: [actor.organizationId] };
    if (actor.role === 'tenant') return { where: 'r.unit_id = $1', params: [actor.unitId] };
    const contractorIds = await this.deps.scope.contractorIdsOf(actor);
    return { where: `EXISTS (SELECT 1 FROM work_order wo WHERE wo.service_request_id = r.id AND wo.contractor_id = ANY($1::uuid[]) AND ${LIVE_JOB})`, params: [contractorIds] };
  }

  private async requireOpen(ctx: TxContext, requestId: string): Promise<void> {
    const [row] = await ctx.db.query(`SELECT status FROM service_request WHERE id = $1 FOR UPDATE`, [requestId]);
    if (!row) throw notFound('service request');
    if (row.status !== 'open') throw conflict(`the request is ${row.status}`);
  }

  private async inTx<T>(actor: Actor, work: (ctx: TxContext) => Promise<T>): Promise<T> {
    const after = new AfterCommit();
    const result = await this.deps.dataSource.transaction((db) => work({ db, now: this.deps.clock.now(), actor, after }));
    await after.run(this.deps.logger);
    return result;
  }

  async view(requestId: string): Promise<ServiceRequestView> {
    const [view] = await requestViews(this.deps.dataSource, 'r.id = $1', [requestId]);
    if (!view) throw notFound('service request');
    return view;
  }
}
