/**
 * CSV text by hand: no CSV writer is among the installed packages (csv-parse only reads).
 * Quoting follows RFC 4180, section 2: fields holding a comma, a double quote, CR or LF
 * are enclosed in double quotes, a double quote inside is doubled, records end in CRLF.
 */

export type CsvValue = string | number | boolean | null | undefined;

/**
 * Cells a spreadsheet would read as a formula get a leading apostrophe: OWASP, "CSV
 * Injection" (characters = + - @, and tab and carriage return at the start). A number we
 * wrote ourselves (a negative count, say) is data, not a formula, and stays as it is.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

export function guardFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

const NEEDS_QUOTES = /[",\r\n]/;

export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  const text = guardFormula(value);
  return NEEDS_QUOTES.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvRecord(values: readonly CsvValue[]): string {
  return `${values.map(csvCell).join(',')}\r\n`;
}

/** A header record and one record per row. */
export function toCsv<R>(columns: readonly { label: string; value: (row: R) => CsvValue }[], rows: readonly R[]): string {
  return [csvRecord(columns.map((c) => c.label)), ...rows.map((row) => csvRecord(columns.map((c) => c.value(row))))].join('');
}
