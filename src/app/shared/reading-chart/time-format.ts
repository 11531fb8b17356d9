/**
 * Time labels for the reading chart in a given IANA time zone (a property's): echarts
 * formats a time axis in the browser's zone only. The label's detail follows the span.
 */
const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

const cache = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string | null, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${timeZone ?? ''}|${JSON.stringify(options)}`;
  let found = cache.get(key);
  if (!found) {
    try {
      found = new Intl.DateTimeFormat('en-US', { ...options, timeZone: timeZone ?? undefined });
    } catch {
      found = new Intl.DateTimeFormat('en-US', options);
    }
    cache.set(key, found);
  }
  return found;
}

/** Axis label: hours and minutes within two days, month and day within two months, else month and year. */
export function axisLabelFormatter(spanMs: number, timeZone: string | null): (valueMs: number) => string {
  const options: Intl.DateTimeFormatOptions =
    spanMs <= 2 * DAY_MS ? { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' } : spanMs <= 62 * DAY_MS ? { month: 'short', day: 'numeric' } : { month: 'short', year: 'numeric' };
  const format = formatter(timeZone, options);
  return (valueMs) => format.format(new Date(valueMs));
}

/** Tooltip heading: the full date and time, with the zone's abbreviation. */
export function tooltipTime(valueMs: number, timeZone: string | null): string {
  return formatter(timeZone, { month: 'short', day: 'numeric', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short' }).format(new Date(valueMs));
}
