import { IncidentExportQuery } from '../../shared/api/monitor';
import { ServiceRequestExportQuery } from '../../shared/api/service-requests';
import { WorkOrderExportQuery } from '../../shared/api/work-orders';
import { RouteGroup, type RouteRule } from '../auth/route-table';
import type { exportsController } from '../controllers/exports';
import { validate } from '../middleware/validate';

const rule = (summary: string): RouteRule => ({ access: ['manager'], scope: 'organization', summary });

/**
 * CSV exports of the manager's tables: the list's filters and sort plus `columns=`, every
 * page, audited. Mounted before the resources' own groups, so `/export` is not read as an id.
 */
export function exportRoutes(controller: ReturnType<typeof exportsController>): RouteGroup[] {
  return [
    new RouteGroup('/api/incidents').get('/export', rule("the organization's filtered incidents as CSV (audited)"), validate({ query: IncidentExportQuery }), controller.incidents),
    new RouteGroup('/api/service-requests').get('/export', rule("the organization's filtered service requests as CSV (audited)"), validate({ query: ServiceRequestExportQuery }), controller.serviceRequests),
    new RouteGroup('/api/work-orders').get('/export', rule("the organization's filtered work orders as CSV (audited)"), validate({ query: WorkOrderExportQuery }), controller.workOrders),
  ];
}
