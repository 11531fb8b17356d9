import { LOGGER_CHART_MAX_POINTS, type LoggerChart } from '../../shared/api/logger-files';
import type { HistoryPoint } from '../../shared/api/telemetry';
import type { Probe } from '../../shared/domain';
import type { LoggerSeries } from '../detection/logger-csv';
import { lttb } from '../telemetry/lttb';

const round2 = (value: number) => Math.round(value * 100) / 100;

function probePoints(atMs: Float64Array, valuesC: Float64Array): HistoryPoint[] {
  const points: HistoryPoint[] = [];
  for (let i = 0; i < atMs.length; i++) {
    const value = valuesC[i];
    if (value === value) points.push([atMs[i], round2(value)]); // NaN marks a blank cell
  }
  return points;
}

/**
 * The file's readings for the browser: each probe downsampled with LTTB (the `downsample`
 * package, through server/telemetry/lttb.ts) to at most LOGGER_CHART_MAX_POINTS, keeping
 * the first and last reading and the shape of every excursion.
 */
export function chartOf(series: LoggerSeries, maxPoints = LOGGER_CHART_MAX_POINTS): LoggerChart {
  const chart: LoggerChart = {};
  const probes: [Probe, boolean, Float64Array][] = [
    ['fresh_food', series.hasFreshFood, series.freshFoodC],
    ['freezer', series.hasFreezer, series.freezerC],
  ];
  for (const [probe, present, values] of probes) {
    if (!present) continue;
    const points = probePoints(series.atMs, values);
    chart[probe] = { points: lttb(points, maxPoints) as [number, number][], readings: points.length };
  }
  return chart;
}
