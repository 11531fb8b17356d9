/** Sends a table's filtered rows as a CSV download and writes the export to the audit log. */
import type { Response } from 'express';
import { COLUMN_LABELS, EXPORT_MAX_ROWS } from '../../shared/api/tables';
import type { Actor } from '../auth/actor';
import { HttpError } from '../errors';
import type { AuditService } from '../services/audit';
import { toCsv, type CsvValue } from './csv';

export type ColumnValues<C extends string, R> = Readonly<Record<C, (row: R) => CsvValue>>;

export interface CsvExport<C extends string, R> {
  /** incidents, service-requests, work-orders: names the file and the audit entry. */
  table: string;
  columns: readonly C[];
  values: ColumnValues<C, R>;
  rows: readonly R[];
  /** The query as given, for the audit entry (ids and codes, nothing secret). */
  filters: Record<string, unknown>;
}

/** Refuses an export past the cap before any row is read, with what to do about it. */
export function assertExportable(matching: number): void {
  if (matching > EXPORT_MAX_ROWS) {
    throw new HttpError(400, `${matching.toLocaleString('en-US')} rows match, and an export holds at most ${EXPORT_MAX_ROWS.toLocaleString('en-US')}: narrow the filters (a date range, a property or a status) and export again.`);
  }
}

/** ISO 8601 in UTC: unambiguous in a spreadsheet whatever the reader's zone. */
export const isoCell = (value: string | null | undefined): CsvValue => value ?? '';

export class CsvExporter {
  constructor(
    private readonly audit: AuditService,
    private readonly now: () => Date,
  ) {}

  async send<C extends string, R>(res: Response, actor: Actor, ip: string | null, csv: CsvExport<C, R>): Promise<void> {
    const body = toCsv(
      csv.columns.map((id) => ({ label: COLUMN_LABELS[id as keyof typeof COLUMN_LABELS] ?? id, value: csv.values[id] })),
      csv.rows,
    );
    await this.audit.record({
      action: 'data-export',
      actor,
      targetType: csv.table,
      ip,
      detail: { format: 'csv', rows: csv.rows.length, columns: csv.columns, filters: csv.filters },
    });
    const day = this.now().toISOString().slice(0, 10);
    // text/csv with header=present: RFC 4180, section 3. The byte-order mark lets spreadsheets read UTF-8 (°, accents): common practice.
    res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
    res.setHeader('Content-Disposition', `attachment; filename="${csv.table}-${day}.csv"`);
    res.setHeader('Cache-Control', 'no-store');
    res.send(`\uFEFF${body}`);
  }
}
