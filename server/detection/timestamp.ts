/**
 * Timestamps of logger files: ISO 8601 with an offset, or epoch milliseconds. The common
 * ISO shape is decoded by hand (Date.parse dominates the read time of a year of rows);
 * anything else falls back to Date.parse. A time without an offset is read as UTC and
 * flagged, because guessing the logger's zone would be worse.
 */

const ZERO = 48;

function digitsAt(text: string, start: number, count: number): number {
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

/** Offset in minutes from "Z", "+HH:MM", "+HHMM" or "+HH"; NaN if unreadable, null if absent. */
function offsetMinutes(text: string, at: number): number | null {
  if (at >= text.length) return null;
  const sign = text[at];
  if (sign === 'Z' || sign === 'z') return at + 1 === text.length ? 0 : NaN;
  if (sign !== '+' && sign !== '-') return NaN;
  const hours = digitsAt(text, at + 1, 2);
  let rest = at + 3;
  if (text[rest] === ':') rest++;
  const minutes = rest < text.length ? digitsAt(text, rest, 2) : 0;
  if (rest < text.length && rest + 2 !== text.length) return NaN;
  const total = hours * 60 + minutes;
  return sign === '-' ? -total : total;
}

function fastIso(text: string, flag: { withoutOffset: boolean }): number {
  // YYYY-MM-DDTHH:MM[:SS[.fff]][offset]
  if (text.length < 16 || text[4] !== '-' || text[7] !== '-' || text[13] !== ':') return NaN;
  const separator = text[10];
  if (separator !== 'T' && separator !== ' ' && separator !== 't') return NaN;
  const year = digitsAt(text, 0, 4);
  const month = digitsAt(text, 5, 2);
  const day = digitsAt(text, 8, 2);
  const hour = digitsAt(text, 11, 2);
  const minute = digitsAt(text, 14, 2);
  let at = 16;
  let second = 0;
  let millisecond = 0;
  if (text[at] === ':') {
    second = digitsAt(text, at + 1, 2);
    at += 3;
    if (text[at] === '.' || text[at] === ',') {
      let fraction = 0;
      let scale = 1;
      at++;
      while (at < text.length && text.charCodeAt(at) >= ZERO && text.charCodeAt(at) <= ZERO + 9) {
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
  const offset = offsetMinutes(text, at);
  if (Number.isNaN(offset)) return NaN;
  if (offset === null) flag.withoutOffset = true;
  const utcMs = Date.UTC(year, month - 1, day, hour, minute, second, Math.round(millisecond));
  return utcMs - (offset ?? 0) * 60_000;
}

/** Milliseconds since the epoch, or NaN when the cell is not a timestamp. */
export function parseTimestampMs(cell: string, flag: { withoutOffset: boolean } = { withoutOffset: false }): number {
  let text = cell;
  if (text.length > 0 && (text.charCodeAt(0) <= 34 || text.charCodeAt(text.length - 1) <= 34)) {
    text = text.trim().replace(/^"(.*)"$/, '$1').trim();
  }
  if (isAllDigits(text)) return Number(text);
  const fast = fastIso(text, flag);
  if (!Number.isNaN(fast)) return fast;
  const hasOffset = /(?:[zZ]|[+-]\d\d(?::?\d\d)?)$/.test(text);
  if (!hasOffset && /^\d{4}-\d\d-\d\d[T ]\d\d:\d\d/.test(text)) {
    flag.withoutOffset = true;
    return Date.parse(`${text.replace(' ', 'T')}Z`);
  }
  return Date.parse(text);
}
