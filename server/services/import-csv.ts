import { CsvError, parse } from 'csv-parse/sync';
import { IMPORT_COLUMNS, IMPORT_MAX_ROWS, IMPORT_REQUIRED_COLUMNS, type ImportColumn, type ImportRowError } from '../../shared/api/inventory';

/** One data row of the inventory file, by column name; missing columns read as ''. */
export interface ImportRow {
  line: number;
  cells: Record<ImportColumn, string>;
  /** True when the row has more cells than the header. */
  extraCells: boolean;
}

export type ReadResult = { ok: true; rows: ImportRow[] } | { ok: false; error: ImportRowError };

const fileError = (message: string, line: number | null = null): ReadResult => ({ ok: false, error: { line, column: null, message } });

/** "Unit Label" and "unit-label" both mean unit_label. */
function columnName(header: string): string {
  return header.trim().toLowerCase().replace(/[\s-]+/g, '_');
}

function readHeader(header: string[]): { columns: (ImportColumn | null)[] } | { error: string } {
  const names = header.map(columnName);
  const unknown = names.filter((name) => name && !(IMPORT_COLUMNS as readonly string[]).includes(name));
  if (unknown.length) return { error: `unknown column${unknown.length > 1 ? 's' : ''} ${unknown.map((n) => `"${n}"`).join(', ')}; the columns are ${IMPORT_COLUMNS.join(', ')}` };
  const missing = IMPORT_REQUIRED_COLUMNS.filter((name) => !names.includes(name));
  if (missing.length) return { error: `the header row has no ${missing.join(', ')} column` };
  const repeated = names.filter((name, index) => name && names.indexOf(name) !== index);
  if (repeated.length) return { error: `column "${repeated[0]}" appears twice in the header row` };
  return { columns: names.map((name) => (name ? (name as ImportColumn) : null)) };
}

function emptyCells(): Record<ImportColumn, string> {
  return Object.fromEntries(IMPORT_COLUMNS.map((column) => [column, ''])) as Record<ImportColumn, string>;
}

/** csv-parse reports the line a record ends on; a quoted cell may span lines. */
function startLine(endLine: number, record: string[]): number {
  const breaks = record.reduce((count, cell) => count + (cell.match(/\n/g)?.length ?? 0), 0);
  return endLine - breaks;
}

/**
 * Reads the inventory CSV (RFC 4180 quoting, through csv-parse). Line endings are
 * normalised first: csv-parse takes the first line's ending for the whole file, and
 * spreadsheets mix them.
 */
export function readInventoryCsv(text: string): ReadResult {
  let records: { record: string[]; info: { lines: number } }[];
  try {
    // With `info: true` csv-parse yields { record, info } objects; its typings only describe plain records.
    records = parse(text.replace(/\r\n?/g, '\n'), { info: true, relax_column_count: true, skip_empty_lines: true, bom: true, trim: true }) as unknown as typeof records;
  } catch (error) {
    if (error instanceof CsvError) return fileError(`the file is not valid CSV: ${error.message}`, (error as CsvError & { lines?: number }).lines ?? null);
    throw error;
  }
  if (!records.length) return fileError('the file is empty: it needs a header row and at least one row');
  const header = readHeader(records[0].record);
  if ('error' in header) return fileError(header.error, 1);
  const data = records.slice(1).filter(({ record }) => record.some((cell) => cell !== ''));
  if (!data.length) return fileError('the file has a header row but no rows to import');
  if (data.length > IMPORT_MAX_ROWS) return fileError(`the file has ${data.length} rows; import at most ${IMPORT_MAX_ROWS} at a time`);
  const rows = data.map(({ record, info }) => {
    const cells = emptyCells();
    header.columns.forEach((column, index) => {
      if (column) cells[column] = record[index] ?? '';
    });
    const extraCells = record.slice(header.columns.length).some((cell) => cell !== '');
    return { line: startLine(info.lines, record), cells, extraCells };
  });
  return { ok: true, rows };
}
