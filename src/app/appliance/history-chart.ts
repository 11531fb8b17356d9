/** The reading chart's data for one range: the history answer plus the appliance's incidents, defrosts and forecast. */
import type { ApplianceDetail } from '../../../shared/api/appliances';
import type { ApplianceHistory } from '../../../shared/api/telemetry';
import { CAUSES } from '../../../shared/causes';
import type { ReadingChartData } from '../shared/reading-chart/chart-data';
import { KIND_LABELS } from '../fleet/appliance-words';
import type { HistoryRange } from './appliance-api';

function overlaps(startMs: number, endMs: number | null, range: HistoryRange): boolean {
  return startMs <= range.toMs && (endMs === null || endMs >= range.fromMs);
}

export function chartDataOf(history: ApplianceHistory, detail: ApplianceDetail, range: HistoryRange): ReadingChartData {
  const incidents = detail.incidents
    .map((incident) => ({ incident, startMs: Date.parse(incident.startedAt), endMs: incident.closedAt ? Date.parse(incident.closedAt) : null }))
    .filter(({ startMs, endMs }) => overlaps(startMs, endMs, range))
    .map(({ incident, startMs, endMs }) => ({
      startMs: Math.max(startMs, range.fromMs),
      endMs: endMs === null ? null : Math.min(endMs, range.toMs),
      label: incident.topCause ? `${KIND_LABELS[incident.kind]}: ${CAUSES[incident.topCause].title.toLowerCase()}` : KIND_LABELS[incident.kind],
    }));
  const defrosts = detail.defrosts.map((d) => ({ atMs: Date.parse(d.at), probe: d.probe })).filter((d) => d.atMs >= range.fromMs && d.atMs <= range.toMs);
  const forecast = detail.forecast && Date.parse(detail.forecast.fromAt) >= range.fromMs && Date.parse(detail.forecast.fromAt) <= range.toMs + 60 * 60_000
    ? { probe: detail.forecast.probe, fromMs: Date.parse(detail.forecast.fromAt), fromC: detail.forecast.fromC, crossingMs: Date.parse(detail.forecast.crossingAt), limitC: detail.forecast.limitC }
    : null;
  return { probes: history.probes, incidents, defrosts, forecast };
}

/** Whether a history answer has any point to draw. */
export function hasReadings(history: ApplianceHistory): boolean {
  return Object.values(history.probes).some((probe) => (probe?.points.length ?? 0) > 0);
}
