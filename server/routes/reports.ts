import { ReportQuery, ReportTableParams } from '../../shared/api/reports';
import { RouteGroup } from '../auth/route-table';
import type { reportsController } from '../controllers/reports';
import { validate } from '../middleware/validate';

/** The manager's reports, and each of their tables as a CSV download. */
export function reportsRoutes(controller: ReturnType<typeof reportsController>): RouteGroup {
  return new RouteGroup('/api/reports')
    .get(
      '/',
      { access: ['manager'], scope: 'organization', summary: 'incidents per 100 appliances per month, response times, first-visit fixes, spend, appliances past life and top causes for a range' },
      validate({ query: ReportQuery }),
      controller.report,
    )
    .get(
      '/:table.csv',
      { access: ['manager'], scope: 'organization', summary: 'one report table as CSV (written to the audit log)' },
      validate({ params: ReportTableParams, query: ReportQuery }),
      controller.csv,
    );
}
