/** Turning what a technician types into what the API takes: money in integer cents, local visit times as instants. */
import { zoneOffsetMs } from '../fleet/zoned-date';

const MONEY_PATTERN = /^\d{1,3}(,\d{3})*(\.\d{1,2})?$|^\d+(\.\d{1,2})?$/;

/** "182.25", "1,250" or "$9.5" → integer cents (18225, 125000, 950); null when it is not an amount of money. */
export function parseMoneyToCents(text: string): number | null {
  const trimmed = text.trim().replace(/^\$/, '').trim();
  if (!MONEY_PATTERN.test(trimmed)) return null;
  const [whole, fraction = ''] = trimmed.replace(/,/g, '').split('.');
  // Whole and fraction added as integers: no binary floating point between the text and the cents.
  return Number(whole) * 100 + Number(fraction.padEnd(2, '0'));
}

const WALL_TIME = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/**
 * A `datetime-local` value read on the property's clocks (not the phone's) → ISO 8601 UTC.
 * Two passes over the zone's offset find the instant across daylight-saving changes.
 */
export function wallTimeToIso(value: string, timeZone: string): string | null {
  const match = WALL_TIME.exec(value);
  if (!match) return null;
  const [, year, month, day, hour, minute] = match.map(Number);
  const wallMs = Date.UTC(year!, month! - 1, day!, hour!, minute!);
  const first = wallMs - safeOffset(timeZone, wallMs);
  return new Date(wallMs - safeOffset(timeZone, first)).toISOString();
}

/** The inverse: an instant as a `datetime-local` value on the property's clocks. */
export function isoToWallTime(atMs: number, timeZone: string): string {
  const wall = new Date(atMs + safeOffset(timeZone, atMs));
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${wall.getUTCFullYear()}-${pad(wall.getUTCMonth() + 1)}-${pad(wall.getUTCDate())}T${pad(wall.getUTCHours())}:${pad(wall.getUTCMinutes())}`;
}

function safeOffset(timeZone: string, atMs: number): number {
  try {
    return zoneOffsetMs(timeZone, atMs);
  } catch {
    return 0; // an unknown zone name: read as UTC rather than fail the form
  }
}
