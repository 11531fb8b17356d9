import type { FindingKind, Health, Severity } from '../../../shared/domain';
import type { LoggerChart, LoggerFinding } from '../../../shared/api/logger-files';
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

/** The reading chart's input: the file's probes, each finding shaded from its start to its end. */
export function chartDataOf(chart: LoggerChart, findings: LoggerFinding[]): ReadingChartData {
  const probes: ReadingChartData['probes'] = {};
  for (const probe of ['fresh_food', 'freezer'] as const) {
    const series = chart[probe];
    if (series) probes[probe] = { points: series.points, envelope: null };
  }
  const incidents = findings
    .filter((finding) => finding.kind !== 'sensor-fault' && finding.started_at)
    .map((finding) => ({
      startMs: Date.parse(finding.started_at!),
      endMs: finding.ended_at ? Date.parse(finding.ended_at) : null,
      label: `${KIND_LABELS[finding.kind]} (${COMPARTMENT_LABELS[finding.compartment]})`,
    }));
  return { probes, incidents };
}
