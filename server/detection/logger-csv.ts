/**
 * Reads a logger file (the CSV contract of DESIGN.md) from its text. No I/O here: the CLI
 * and the web upload hand in the text. A hand-written scanner rather than csv-parse: the
 * contract has no quoted commas or multi-line cells, and scanning with indexOf/charCodeAt
 * reads a year of one-minute rows several times faster (see spec/bench/csv-read-bench.ts).
 */
import { fToC } from '../../shared/temperature';
import { parseTimestampAt } from './timestamp';

export class LoggerFileError extends Error {}

/** Columnar readings, sorted by time and de-duplicated; NaN marks a missing value. */
export interface LoggerSeries {
  atMs: Float64Array;
  freshFoodC: Float64Array;
  freezerC: Float64Array;
  hasFreshFood: boolean;
  hasFreezer: boolean;
}

export interface LoggerFileReport {
  rows: number;
  rowsSkipped: number;
  duplicatesMerged: number;
  cellsUnreadable: number;
  temperatureUnit: 'C' | 'F';
  timestampsWithoutOffset: boolean;
}

export interface ParsedLoggerFile {
  series: LoggerSeries;
  report: LoggerFileReport;
}

interface Columns {
  timestamp: number;
  freshFood: number;
  freezer: number;
  fahrenheit: boolean;
  count: number;
}

function cleanHeader(cell: string): string {
  return cell.trim().replace(/^\uFEFF/, '').replace(/^"(.*)"$/, '$1').trim().toLowerCase();
}

function findColumns(headerLine: string): Columns {
  const names = headerLine.split(',').map(cleanHeader);
  const timestamp = names.indexOf('timestamp');
  if (timestamp < 0) throw new LoggerFileError('no "timestamp" column in the header row');
  const pick = (base: string): { index: number; fahrenheit: boolean } => {
    const celsius = names.indexOf(`${base}_c`);
    if (celsius >= 0) return { index: celsius, fahrenheit: false };
    return { index: names.indexOf(`${base}_f`), fahrenheit: true };
  };
  const fresh = pick('fresh_food');
  const freezer = pick('freezer');
  if (fresh.index < 0 && freezer.index < 0) {
    throw new LoggerFileError('no temperature column (fresh_food_c, freezer_c, fresh_food_f or freezer_f) in the header row');
  }
  const usedFahrenheit = (fresh.index >= 0 && fresh.fahrenheit) || (freezer.index >= 0 && freezer.fahrenheit);
  const usedCelsius = (fresh.index >= 0 && !fresh.fahrenheit) || (freezer.index >= 0 && !freezer.fahrenheit);
  if (usedFahrenheit && usedCelsius) throw new LoggerFileError('mixed °C and °F temperature columns');
  return { timestamp, freshFood: fresh.index, freezer: freezer.index, fahrenheit: usedFahrenheit, count: names.length };
}

/**
 * Parses the temperature in text[from, end) without making a substring: NaN for an empty
 * cell, undefined for an unreadable one. Plain decimals take the fast path; anything else
 * (spaces, quotes, exponents) goes through Number().
 */
function parseCellAt(text: string, from: number, end: number, fahrenheit: boolean): number | undefined {
  if (from >= end) return NaN;
  let at = from;
  let negative = false;
  const first = text.charCodeAt(at);
  if (first === 45 || first === 43) {
    negative = first === 45;
    at++;
  }
  let value = 0;
  let digits = 0;
  let scale = 0;
  for (; at < end; at++) {
    const code = text.charCodeAt(at);
    if (code >= 48 && code <= 57) {
      value = value * 10 + (code - 48);
      digits++;
      if (scale) scale *= 10;
    } else if (code === 46 && !scale) {
      scale = 1;
    } else {
      return parseCellSlow(text.slice(from, end), fahrenheit);
    }
  }
  if (digits === 0) return parseCellSlow(text.slice(from, end), fahrenheit);
  const number = (negative ? -value : value) / (scale || 1);
  return fahrenheit ? fToC(number) : number;
}

function parseCellSlow(cell: string, fahrenheit: boolean): number | undefined {
  const text = cell.trim().replace(/^"(.*)"$/, '$1').trim();
  if (text.length === 0) return NaN;
  const value = Number(text);
  if (!Number.isFinite(value)) return undefined;
  return fahrenheit ? fToC(value) : value;
}

class Growable {
  atMs = new Float64Array(1024);
  fresh = new Float64Array(1024);
  freezer = new Float64Array(1024);
  length = 0;

  push(atMs: number, fresh: number, freezer: number): void {
    if (this.length === this.atMs.length) this.grow();
    this.atMs[this.length] = atMs;
    this.fresh[this.length] = fresh;
    this.freezer[this.length] = freezer;
    this.length++;
  }

  private grow(): void {
    const size = this.atMs.length * 2;
    const copy = (from: Float64Array) => {
      const to = new Float64Array(size);
      to.set(from);
      return to;
    };
    this.atMs = copy(this.atMs);
    this.fresh = copy(this.fresh);
    this.freezer = copy(this.freezer);
  }
}

/** Start and end of the cells of one line inside the whole text (no substrings). */
function cellBounds(text: string, lineStart: number, lineEnd: number, starts: Int32Array, ends: Int32Array): number {
  let start = lineStart;
  let found = 0;
  while (found < starts.length) {
    let comma = text.indexOf(',', start);
    if (comma < 0 || comma > lineEnd) comma = lineEnd;
    starts[found] = start;
    ends[found] = comma;
    found++;
    if (comma === lineEnd) break;
    start = comma + 1;
  }
  return found;
}

function cellAt(text: string, column: number, found: number, starts: Int32Array, ends: Int32Array, fahrenheit: boolean): number | undefined {
  if (column < 0 || column >= found) return NaN;
  return parseCellAt(text, starts[column], ends[column], fahrenheit);
}

export function parseLoggerCsv(text: string): ParsedLoggerFile {
  const firstBreak = text.indexOf('\n');
  const headerLine = (firstBreak < 0 ? text : text.slice(0, firstBreak)).replace(/\r$/, '');
  if (headerLine.trim().length === 0) throw new LoggerFileError('the file is empty or has no header row');
  const columns = findColumns(headerLine);
  const rows = new Growable();
  const report: LoggerFileReport = {
    rows: 0,
    rowsSkipped: 0,
    duplicatesMerged: 0,
    cellsUnreadable: 0,
    temperatureUnit: columns.fahrenheit ? 'F' : 'C',
    timestampsWithoutOffset: false,
  };
  const starts = new Int32Array(columns.count);
  const ends = new Int32Array(columns.count);
  const offsetFlag = { withoutOffset: false };
  let position = firstBreak < 0 ? text.length : firstBreak + 1;
  while (position < text.length) {
    let end = text.indexOf('\n', position);
    if (end < 0) end = text.length;
    const lineEnd = end > position && text.charCodeAt(end - 1) === 13 ? end - 1 : end;
    const lineStart = position;
    position = end + 1;
    if (lineEnd === lineStart) continue;
    report.rows++;
    const found = cellBounds(text, lineStart, lineEnd, starts, ends);
    const atMs = found > columns.timestamp ? parseTimestampAt(text, starts[columns.timestamp], ends[columns.timestamp], offsetFlag) : NaN;
    if (!Number.isFinite(atMs)) {
      report.rowsSkipped++;
      continue;
    }
    const fresh = cellAt(text, columns.freshFood, found, starts, ends, columns.fahrenheit);
    const freezer = cellAt(text, columns.freezer, found, starts, ends, columns.fahrenheit);
    if (fresh === undefined || freezer === undefined) report.cellsUnreadable++;
    rows.push(atMs, fresh ?? NaN, freezer ?? NaN);
  }
  report.timestampsWithoutOffset = offsetFlag.withoutOffset;
  if (rows.length === 0) throw new LoggerFileError('no row with a readable timestamp');
  const series = sortAndMerge(rows, columns, report);
  return { series, report };
}

function isSorted(atMs: Float64Array, length: number): boolean {
  for (let i = 1; i < length; i++) if (atMs[i] < atMs[i - 1]) return false;
  return true;
}

function sortedOrder(atMs: Float64Array, length: number): Uint32Array {
  const order = new Uint32Array(length);
  for (let i = 0; i < length; i++) order[i] = i;
  if (!isSorted(atMs, length)) order.sort((a, b) => atMs[a] - atMs[b] || a - b);
  return order;
}

/** Sorts by time and merges rows with the same timestamp (the first value of each probe wins). */
function sortAndMerge(rows: Growable, columns: Columns, report: LoggerFileReport): LoggerSeries {
  const order = sortedOrder(rows.atMs, rows.length);
  const atMs = new Float64Array(rows.length);
  const fresh = new Float64Array(rows.length);
  const freezer = new Float64Array(rows.length);
  let count = 0;
  for (let k = 0; k < order.length; k++) {
    const i = order[k];
    if (count > 0 && atMs[count - 1] === rows.atMs[i]) {
      report.duplicatesMerged++;
      if (Number.isNaN(fresh[count - 1])) fresh[count - 1] = rows.fresh[i];
      if (Number.isNaN(freezer[count - 1])) freezer[count - 1] = rows.freezer[i];
      continue;
    }
    atMs[count] = rows.atMs[i];
    fresh[count] = rows.fresh[i];
    freezer[count] = rows.freezer[i];
    count++;
  }
  return {
    atMs: atMs.subarray(0, count),
    freshFoodC: fresh.subarray(0, count),
    freezerC: freezer.subarray(0, count),
    hasFreshFood: columns.freshFood >= 0,
    hasFreezer: columns.freezer >= 0,
  };
}
