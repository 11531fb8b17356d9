import { startOfDayInZone } from '../../fleet/zoned-date';

/** `2026-11-01` as its parts, or null when it is not such a date. */
function dayParts(day: string | undefined): [number, number, number] | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day ?? '');
  return match ? [Number(match[1]), Number(match[2]) - 1, Number(match[3])] : null;
}

/**
 * The filter bar's day range as the instants the API takes: from the start of the first
 * day to the start of the day after the last (the last day is included), in the user's zone.
 */
export function openedRange(fromDay: string | undefined, toDay: string | undefined, timeZone: string): { openedFrom?: string; openedTo?: string } {
  const from = dayParts(fromDay);
  const to = dayParts(toDay);
  return {
    openedFrom: from ? new Date(startOfDayInZone(from[0], from[1], from[2], timeZone)).toISOString() : undefined,
    openedTo: to ? new Date(startOfDayInZone(to[0], to[1], to[2] + 1, timeZone)).toISOString() : undefined,
  };
}

export function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}
