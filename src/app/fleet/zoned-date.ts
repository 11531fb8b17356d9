import { Pipe, type PipeTransform } from '@angular/core';

export type ZonedDateStyle = 'date' | 'time' | 'date-time' | 'short';

const OPTIONS: Record<ZonedDateStyle, Intl.DateTimeFormatOptions> = {
  date: { year: 'numeric', month: 'short', day: 'numeric' },
  time: { hour: '2-digit', minute: '2-digit' },
  'date-time': { year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit', timeZoneName: 'short' },
  short: { month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit' },
};

const formatters = new Map<string, Intl.DateTimeFormat>();

/**
 * A time shown in a property's own time zone (an IANA name such as America/Chicago):
 * Angular's DatePipe takes only offsets, which shift with daylight saving time.
 */
export function formatZoned(value: string | number | Date | null | undefined, timeZone: string | null | undefined, style: ZonedDateStyle = 'date-time'): string {
  if (value === null || value === undefined || value === '') return '—';
  const date = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(date.getTime())) return '—';
  const key = `${timeZone ?? ''}|${style}`;
  let formatter = formatters.get(key);
  if (!formatter) {
    try {
      formatter = new Intl.DateTimeFormat('en-US', { ...OPTIONS[style], timeZone: timeZone ?? undefined });
    } catch {
      formatter = new Intl.DateTimeFormat('en-US', OPTIONS[style]); // an unknown zone name: the browser's own
    }
    formatters.set(key, formatter);
  }
  return formatter.format(date);
}

/** `{{ at | cwZoned: property.timeZone : 'short' }}` */
@Pipe({ name: 'cwZoned' })
export class ZonedDatePipe implements PipeTransform {
  transform(value: string | number | Date | null | undefined, timeZone: string | null | undefined, style: ZonedDateStyle = 'date-time'): string {
    return formatZoned(value, timeZone, style);
  }
}

/** How far ahead of UTC a time zone's wall clock is at `atMs` (negative west of Greenwich). */
export function zoneOffsetMs(timeZone: string, atMs: number): number {
  const parts = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric' }).formatToParts(new Date(atMs));
  const part = (type: string) => Number(parts.find((p) => p.type === type)?.value ?? 0);
  const wallAsUtcMs = Date.UTC(part('year'), part('month') - 1, part('day'), part('hour'), part('minute'), part('second'));
  return wallAsUtcMs - Math.floor(atMs / 1000) * 1000;
}

/** The instant a calendar day begins in a time zone (midnight on its clocks), daylight saving time included. */
export function startOfDayInZone(year: number, monthIndex: number, day: number, timeZone: string): number {
  const guessMs = Date.UTC(year, monthIndex, day);
  const first = guessMs - zoneOffsetMs(timeZone, guessMs);
  return guessMs - zoneOffsetMs(timeZone, first);
}
