import type { FindingKind, Health, Severity } from '../../../shared/domain';
import type { LoggerChart, LoggerFinding } from '../../../shared/api/logger-files';
import { capitalise } from '../inventory/messages';
import type { ReadingChartData } from '../shared/reading-chart/chart-data';

export const KIND_LABELS: Readonly<Record<FindingKind, string>> = {
  'over-temperature': 'Over temperature',
  'warming-trend': 'Warming trend',
  'no-cooling': 'No cooling',
  'sensor-fault': 'Sensor fault',
  'power-loss': 'Power loss',
};

export const HEALTH_LABELS: Readonly<Record<Health, string>> = {
  cold: 'cold',
  drifting: 'drifting',
  warm: 'warm',
  'no-cooling': 'no cooling',
  silent: 'silent',
};

export const SEVERITY_LABELS: Readonly<Record<Severity, string>> = { info: 'info', watch: 'watch', urgent: 'urgent', critical: 'critical' };

export const COMPARTMENT_LABELS: Readonly<Record<LoggerFinding['compartment'], string>> = { fresh_food: 'fresh food', freezer: 'freezer', both: 'both compartments' };

interface Span {
  startMs: number;
  endMs: number | null;
  kinds: string[];
}

/**
 * Findings of one episode overlap (an over-temperature and the warming trend behind it):
 * shaded one by one they stack into an unreadable block, so overlapping spans are merged
 * into one band that names every kind in it.
 */
export function mergedSpans(findings: LoggerFinding[]): ReadingChartData['incidents'] {
  const spans = findings
    .filter((finding) => finding.kind !== 'sensor-fault' && finding.started_at)
    .map((finding) => ({ startMs: Date.parse(finding.started_at!), endMs: finding.ended_at ? Date.parse(finding.ended_at) : null, kind: `${KIND_LABELS[finding.kind].toLowerCase()} (${COMPARTMENT_LABELS[finding.compartment]})` }))
    .sort((a, b) => a.startMs - b.startMs);
  const merged: Span[] = [];
  for (const span of spans) {
    const last = merged[merged.length - 1];
    if (last && (last.endMs === null || span.startMs <= last.endMs)) {
      last.endMs = last.endMs === null || span.endMs === null ? null : Math.max(last.endMs, span.endMs);
      if (!last.kinds.includes(span.kind)) last.kinds.push(span.kind);
    } else {
      merged.push({ startMs: span.startMs, endMs: span.endMs, kinds: [span.kind] });
    }
  }
  return merged.map((span) => ({ startMs: span.startMs, endMs: span.endMs, label: capitalise(span.kinds.join(', ')) }));
}

/** The reading chart's input: the file's probes, with its findings shaded. */
export function chartDataOf(chart: LoggerChart, findings: LoggerFinding[]): ReadingChartData {
  const probes: ReadingChartData['probes'] = {};
  for (const probe of ['fresh_food', 'freezer'] as const) {
    const series = chart[probe];
    if (series) probes[probe] = { points: series.points, envelope: null };
  }
  return { probes, incidents: mergedSpans(findings) };
}
