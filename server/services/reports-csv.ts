/**
 * CSV for the report downloads. Quoting follows RFC 4180 (section 2): records end in CRLF,
 * a field holding a comma, a double quote, CR or LF is enclosed in double quotes and its
 * double quotes doubled. Text that a spreadsheet would run as a formula (first character
 * =, +, -, @, tab or CR) gets a leading apostrophe, as OWASP "CSV Injection" advises;
 * numbers are written as numbers and never prefixed, so −5 stays a number.
 */
export type CsvValue = string | number | boolean | null;

const FORMULA_START = /^[=+\-@\t\r]/;
const NEEDS_QUOTES = /[",\r\n]/;

export function csvField(value: CsvValue): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  const guarded = FORMULA_START.test(value) ? `'${value}` : value;
  return NEEDS_QUOTES.test(guarded) ? `"${guarded.replace(/"/g, '""')}"` : guarded;
}

export interface CsvTable {
  header: string[];
  rows: CsvValue[][];
}

export function toCsv(table: CsvTable): string {
  return [table.header, ...table.rows].map((row) => row.map(csvField).join(',')).join('\r\n') + '\r\n';
}
