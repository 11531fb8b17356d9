import type { Request, Response } from 'express';
import type { ReportQuery, ReportTable } from '../../shared/api/reports';
import { actorOf } from '../auth/actor';
import type { AuditService } from '../services/audit';
import { TABLE_SECTION, type ReportsService } from '../services/reports';
import { toCsv } from '../services/reports-csv';
import { reportTable } from '../services/reports-tables';

export function reportsController(reports: ReportsService, audit: AuditService) {
  return {
    report: async (req: Request, res: Response) => {
      res.json(await reports.summary(actorOf(req), req.query as unknown as ReportQuery));
    },

    /** A table as CSV; every download is written to the audit log (what, which range, how many rows). */
    csv: async (req: Request, res: Response) => {
      const actor = actorOf(req);
      const table = req.params.table as ReportTable;
      const view = await reports.report(actor, req.query as unknown as ReportQuery, [TABLE_SECTION[table]]);
      const rows = reportTable(view, table);
      const { from, to, propertyId } = view.range;
      await audit.record({
        action: 'data-export',
        actor,
        targetType: 'report',
        targetId: table,
        ip: req.ip ?? null,
        detail: { table, from, to, propertyId, rows: rows.rows.length },
      });
      res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
      res.setHeader('Content-Disposition', `attachment; filename="chillwarden-${table}-${from}-to-${to}.csv"`);
      res.setHeader('Cache-Control', 'no-store');
      res.send(toCsv(rows));
    },
  };
}
