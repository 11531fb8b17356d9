/** The chart's range presets and how a choice becomes a time range. */
import type { ApplianceHistory } from '../../../shared/api/telemetry';
import type { HistoryRange } from './appliance-api';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

export const RANGE_PRESETS = [
  { key: '6h', label: '6 h', spanMs: 6 * HOUR_MS },
  { key: '24h', label: '24 h', spanMs: DAY_MS },
  { key: '7d', label: '7 d', spanMs: 7 * DAY_MS },
  { key: '30d', label: '30 d', spanMs: 30 * DAY_MS },
  { key: '1y', label: '1 y', spanMs: 365 * DAY_MS },
] as const;

export type PresetKey = (typeof RANGE_PRESETS)[number]['key'];
export type RangeChoice = { kind: 'preset'; key: PresetKey } | { kind: 'custom'; fromMs: number; toMs: number };

export const DEFAULT_CHOICE: RangeChoice = { kind: 'preset', key: '24h' };

/** A preset ends now; a custom range is what was picked. */
export function rangeOf(choice: RangeChoice, nowMs: number): HistoryRange {
  if (choice.kind === 'custom') return { fromMs: choice.fromMs, toMs: choice.toMs };
  const preset = RANGE_PRESETS.find((p) => p.key === choice.key) ?? RANGE_PRESETS[1];
  return { fromMs: nowMs - preset.spanMs, toMs: nowMs };
}

/** Points to ask for: about two per pixel of chart width, within what the API allows. */
export function maxPointsFor(chartWidthPx: number): number {
  return Math.min(2000, Math.max(200, Math.round(chartWidthPx * 2)));
}

function durationWords(ms: number): string {
  if (ms % DAY_MS === 0) return `${ms / DAY_MS}-day`;
  if (ms % HOUR_MS === 0) return `${ms / HOUR_MS}-hour`;
  return `${Math.round(ms / 60_000)}-minute`;
}

/** What the chart shows, in words: the history API says which resolution it chose. */
export function resolutionWords(history: Pick<ApplianceHistory, 'resolution' | 'bucketMs' | 'source'>): string {
  if (history.resolution === 'raw') return 'every reading';
  if (history.resolution === 'lttb') return 'readings thinned for the screen (largest-triangle method)';
  return `${durationWords(history.bucketMs ?? (history.source === 'rollup_5m' ? 5 * 60_000 : HOUR_MS))} means with their min–max band`;
}
