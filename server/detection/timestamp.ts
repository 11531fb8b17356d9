/**
 * Timestamps of logger files: ISO 8601 with an offset, or epoch milliseconds. The common
 * ISO shape is decoded by hand (Date.parse dominates the read time of a year of rows);
 * anything else falls back to Date.parse. A time without an offset is read as UTC and
 * flagged, because guessing the logger's zone would be worse.
 */

const ZERO = 48;

function digitsAt(text: string, start: number, count: number): number {
  if (start + count > text.length) return NaN;
  let value = 0;
  for (let i = start; i < start + count; i++) {
    const digit = text.charCodeAt(i) - ZERO;
    if (digit < 0 || digit > 9) return NaN;
    value = value * 10 + digit;
  }
  return value;
}

function isAllDigits(text: string): boolean {
  if (text.length === 0) return false;
  for (let i = 0; i < text.length; i++) {
    const digit = text.charCodeAt(i) - ZERO;
    if (digit < 0 || digit > 9) return false;
  }
  return true;
}

/** Offset in minutes from "Z", "+HH:MM", "+HHMM" or "+HH" at [at, end); NaN if unreadable, null if absent. */
function offsetMinutes(text: string, at: number, end: number): number | null {
  if (at >= end) return null;
  const sign = text[at];
  if (sign === 'Z' || sign === 'z') return at + 1 === end ? 0 : NaN;
  if (sign !== '+' && sign !== '-') return NaN;
  const hours = digitsAt(text, at + 1, 2);
  let rest = at + 3;
  if (text[rest] === ':') rest++;
  const minutes = rest < end ? digitsAt(text, rest, 2) : 0;
  if (rest < end && rest + 2 !== end) return NaN;
  const total = hours * 60 + minutes;
  return sign === '-' ? -total : total;
}

/** YYYY-MM-DDTHH:MM[:SS[.fff]][offset] inside text[from, end), without making a substring. */
function fastIso(text: string, from: number, end: number, flag: { withoutOffset: boolean }): number {
  if (end - from < 16 || text[from + 4] !== '-' || text[from + 7] !== '-' || text[from + 13] !== ':') return NaN;
  const separator = text[from + 10];
  if (separator !== 'T' && separator !== ' ' && separator !== 't') return NaN;
  const year = digitsAt(text, from, 4);
  const month = digitsAt(text, from + 5, 2);
  const day = digitsAt(text, from + 8, 2);
  const hour = digitsAt(text, from + 11, 2);
  const minute = digitsAt(text, from + 14, 2);
  let at = from + 16;
  let second = 0;
  let millisecond = 0;
  if (at < end && text[at] === ':') {
    second = digitsAt(text, at + 1, 2);
    at += 3;
    if (at < end && (text[at] === '.' || text[at] === ',')) {
      let fraction = 0;
      let scale = 1;
      at++;
      while (at < end && text.charCodeAt(at) >= ZERO && text.charCodeAt(at) <= ZERO + 9) {
        if (scale < 1000) {
          fraction = fraction * 10 + (text.charCodeAt(at) - ZERO);
          scale *= 10;
        }
        at++;
      }
      millisecond = (fraction * 1000) / scale;
    }
  }
  if (month < 1 || month > 12 || day < 1 || day > 31 || hour > 24 || minute > 59 || second > 60) return NaN;
  const offset = offsetMinutes(text, at, end);
  if (Number.isNaN(offset)) return NaN;
  if (offset === null) flag.withoutOffset = true;
  return dayStartMs(year, month, day) + ((hour * 60 + minute - (offset ?? 0)) * 60 + second) * 1000 + Math.round(millisecond);
}

// Consecutive rows share their date: Date.UTC runs once per day of readings, not once per row.
let cachedDayKey = -1;
let cachedDayMs = 0;

function dayStartMs(year: number, month: number, day: number): number {
  const key = (year * 100 + month) * 100 + day;
  if (key !== cachedDayKey) {
    cachedDayKey = key;
    cachedDayMs = Date.UTC(year, month - 1, day);
  }
  return cachedDayMs;
}

/** Epoch milliseconds written as plain digits in text[from, end), or NaN. */
function epochDigits(text: string, from: number, end: number): number {
  if (end <= from || end - from > 16) return NaN;
  let value = 0;
  for (let i = from; i < end; i++) {
    const digit = text.charCodeAt(i) - ZERO;
    if (digit < 0 || digit > 9) return NaN;
    value = value * 10 + digit;
  }
  return value;
}

/** The timestamp in text[from, end) (a CSV cell inside the whole file), or NaN. */
export function parseTimestampAt(text: string, from: number, end: number, flag: { withoutOffset: boolean }): number {
  const epoch = epochDigits(text, from, end);
  if (!Number.isNaN(epoch)) return epoch;
  const fast = fastIso(text, from, end, flag);
  if (!Number.isNaN(fast)) return fast;
  return parseTimestampMs(text.slice(from, end), flag);
}

/** Milliseconds since the epoch, or NaN when the cell is not a timestamp. */
export function parseTimestampMs(cell: string, flag: { withoutOffset: boolean } = { withoutOffset: false }): number {
  const text = cell.trim().replace(/^"(.*)"$/, '$1').trim();
  if (isAllDigits(text)) return Number(text);
  const fast = fastIso(text, 0, text.length, flag);
  if (!Number.isNaN(fast)) return fast;
  const hasOffset = /(?:[zZ]|[+-]\d\d(?::?\d\d)?)$/.test(text);
  if (!hasOffset && /^\d{4}-\d\d-\d\d[T ]\d\d:\d\d/.test(text)) {
    flag.withoutOffset = true;
    return Date.parse(`${text.replace(' ', 'T')}Z`);
  }
  return Date.parse(text);
}
