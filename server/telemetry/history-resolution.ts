import type { HistoryResolution, HistorySource } from '../../shared/api/telemetry';

export const DEFAULT_MAX_POINTS = 2000;
const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;
const DAY_MS = 24 * HOUR_MS;

/** Widths hourly rollups are merged into for long ranges: whole hours, then whole days. */
const MERGED_WIDTHS_MS = [2, 3, 4, 6, 8, 12].map((h) => h * HOUR_MS).concat([1, 2, 3, 7, 14, 30].map((d) => d * DAY_MS));

/** LTTB works on at most this many source points (raw, else 5-minute, else hourly means). */
export const LTTB_MAX_SOURCE_POINTS = 50_000;

export interface HistoryPlan {
  resolution: HistoryResolution;
  source: HistorySource;
  /** Point width for rollups; null for raw readings and LTTB. */
  bucketMs: number | null;
}

/** Buckets of `widthMs` that overlap [from, to): one more than the quotient at most. */
function bucketCount(rangeMs: number, widthMs: number): number {
  return Math.ceil(rangeMs / widthMs) + 1;
}

/**
 * Raw readings when there are few enough, else the finest rollup that fits `maxPoints`
 * buckets, else hourly rollups merged into the narrowest width that fits.
 */
export function planAuto(rangeMs: number, rawPerProbe: number, maxPoints: number): HistoryPlan {
  if (rawPerProbe <= maxPoints) return { resolution: 'raw', source: 'reading', bucketMs: null };
  if (bucketCount(rangeMs, 5 * MINUTE_MS) <= maxPoints) return { resolution: 'rollup', source: 'rollup_5m', bucketMs: 5 * MINUTE_MS };
  if (bucketCount(rangeMs, HOUR_MS) <= maxPoints) return { resolution: 'rollup', source: 'rollup_1h', bucketMs: HOUR_MS };
  const widthMs = MERGED_WIDTHS_MS.find((width) => bucketCount(rangeMs, width) <= maxPoints) ?? Math.ceil(rangeMs / (maxPoints - 1) / DAY_MS) * DAY_MS;
  return { resolution: 'rollup', source: 'rollup_1h', bucketMs: widthMs };
}

/** LTTB picks from the finest source that stays under LTTB_MAX_SOURCE_POINTS. */
export function planLttb(rangeMs: number, rawPerProbe: number): HistoryPlan {
  if (rawPerProbe <= LTTB_MAX_SOURCE_POINTS) return { resolution: 'lttb', source: 'reading', bucketMs: null };
  if (bucketCount(rangeMs, 5 * MINUTE_MS) <= LTTB_MAX_SOURCE_POINTS) return { resolution: 'lttb', source: 'rollup_5m', bucketMs: null };
  return { resolution: 'lttb', source: 'rollup_1h', bucketMs: null };
}
