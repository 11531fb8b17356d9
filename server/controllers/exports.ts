import type { Request, Response } from 'express';
import type { IncidentExportQuery } from '../../shared/api/monitor';
import type { ServiceRequestExportQuery } from '../../shared/api/service-requests';
import type { WorkOrderExportQuery } from '../../shared/api/work-orders';
import { actorOf } from '../auth/actor';
import type { CsvExporter } from '../exports/csv-export';
import { INCIDENT_CSV, type IncidentsService } from '../services/incidents';
import { REQUEST_CSV, type ServiceRequestsService } from '../services/service-requests';
import { WORK_ORDER_CSV } from '../services/work-order-list';
import type { WorkOrdersService } from '../services/work-orders';

export interface ExportSources {
  exporter: CsvExporter;
  incidents: IncidentsService;
  serviceRequests: ServiceRequestsService;
  workOrders: WorkOrdersService;
}

/** The query minus the column list, for the audit entry. */
function filtersOf(query: { columns: string[] }): Record<string, unknown> {
  const { columns: _columns, ...filters } = query;
  return filters;
}

export function exportsController(sources: ExportSources) {
  const ip = (req: Request) => req.ip ?? null;
  return {
    incidents: async (req: Request, res: Response) => {
      const query = req.query as unknown as IncidentExportQuery;
      const rows = await sources.incidents.exportRows(actorOf(req), query);
      await sources.exporter.send(res, actorOf(req), ip(req), { table: 'incidents', columns: query.columns, values: INCIDENT_CSV, rows, filters: filtersOf(query) });
    },
    serviceRequests: async (req: Request, res: Response) => {
      const query = req.query as unknown as ServiceRequestExportQuery;
      const rows = await sources.serviceRequests.exportRows(actorOf(req), query);
      await sources.exporter.send(res, actorOf(req), ip(req), { table: 'service-requests', columns: query.columns, values: REQUEST_CSV, rows, filters: filtersOf(query) });
    },
    workOrders: async (req: Request, res: Response) => {
      const query = req.query as unknown as WorkOrderExportQuery;
      const rows = await sources.workOrders.exportRows(actorOf(req), query);
      await sources.exporter.send(res, actorOf(req), ip(req), { table: 'work-orders', columns: query.columns, values: WORK_ORDER_CSV, rows, filters: filtersOf(query) });
    },
  };
}
