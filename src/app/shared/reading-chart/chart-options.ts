import type { EChartsCoreOption } from 'echarts/core';
import type { Probe } from '../../../../shared/domain';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C, cToF, type TemperatureUnit } from '../../../../shared/temperature';
import type { ChartPalette, ReadingChartData } from './chart-data';
import { axisLabelFormatter, tooltipTime } from './time-format';

const PROBE_LABEL: Record<Probe, string> = { fresh_food: 'Fresh food', freezer: 'Freezer' };
const PROBE_LIMIT_C: Record<Probe, number> = { fresh_food: FRESH_FOOD_LIMIT_C, freezer: FREEZER_LIMIT_C };

function converter(unit: TemperatureUnit): (tempC: number) => number {
  return unit === 'F' ? (tempC) => Math.round(cToF(tempC) * 10) / 10 : (tempC) => Math.round(tempC * 10) / 10;
}

function colorOf(probe: Probe, palette: ChartPalette): string {
  return probe === 'fresh_food' ? palette.freshFood : palette.freezer;
}

/**
 * The food-safety limit as a line and the unsafe side of it as a faint band. With both
 * probes on one axis the freezer's unsafe side would cover the fresh-food section's
 * normal range, so the freezer gets its band only when it is the only probe.
 */
function limitMarks(probe: Probe, unit: TemperatureUnit, palette: ChartPalette, shaded: boolean) {
  const toUnit = converter(unit);
  const limit = toUnit(PROBE_LIMIT_C[probe]);
  return {
    markLine: {
      silent: true,
      symbol: 'none',
      lineStyle: { color: palette.limit, type: 'dashed', width: 1 },
      label: { formatter: `${PROBE_LABEL[probe]} limit ${limit} °${unit}`, color: palette.text, position: 'insideEndTop' },
      data: [{ yAxis: limit }],
    },
    markArea: shaded ? { silent: true, itemStyle: { color: palette.limit, opacity: 0.07 }, data: [[{ yAxis: limit }, { yAxis: 'max' }]] } : undefined,
  };
}

/** Min/max envelope as a stacked band: an invisible floor at min, then (max − min) on top. */
function envelopeSeries(probe: Probe, envelope: [number, number, number][], unit: TemperatureUnit, palette: ChartPalette) {
  const toUnit = converter(unit);
  const stack = `envelope-${probe}`;
  return [
    {
      name: `${PROBE_LABEL[probe]} range`,
      type: 'line',
      stack,
      symbol: 'none',
      silent: true,
      lineStyle: { opacity: 0 },
      data: envelope.map(([atMs, minC]) => [atMs, toUnit(minC)]),
      tooltip: { show: false },
    },
    {
      name: `${PROBE_LABEL[probe]} range`,
      type: 'line',
      stack,
      symbol: 'none',
      silent: true,
      lineStyle: { opacity: 0 },
      areaStyle: { color: colorOf(probe, palette), opacity: 0.16 },
      data: envelope.map(([atMs, minC, maxC]) => [atMs, Math.round((toUnit(maxC) - toUnit(minC)) * 10) / 10]),
      tooltip: { show: false },
    },
  ];
}

function probeSeries(probe: Probe, data: ReadingChartData, unit: TemperatureUnit, palette: ChartPalette, shaded: boolean) {
  const toUnit = converter(unit);
  const series = data.probes[probe]!;
  const defrosts = (data.defrosts ?? []).filter((d) => d.probe === probe);
  const nearest = (atMs: number) => series.points.reduce((best, point) => (Math.abs(point[0] - atMs) < Math.abs(best[0] - atMs) ? point : best), series.points[0]!);
  return {
    name: PROBE_LABEL[probe],
    type: 'line',
    showSymbol: false,
    sampling: 'none',
    lineStyle: { width: 1.6, color: colorOf(probe, palette) },
    itemStyle: { color: colorOf(probe, palette) },
    data: series.points.map(([atMs, tempC]) => [atMs, toUnit(tempC)]),
    ...limitMarks(probe, unit, palette, shaded),
    markPoint: defrosts.length && series.points.length
      ? {
          symbol: 'pin',
          symbolSize: 22,
          itemStyle: { color: palette.grid },
          label: { formatter: 'D', fontSize: 9, color: palette.text },
          data: defrosts.map((d) => {
            const [atMs, tempC] = nearest(d.atMs);
            return { name: 'Defrost', coord: [atMs, toUnit(tempC)] };
          }),
        }
      : undefined,
  };
}

function incidentSeries(data: ReadingChartData, palette: ChartPalette, endMs: number) {
  return {
    name: 'Incidents',
    type: 'line',
    data: [],
    markArea: {
      silent: true,
      itemStyle: { color: palette.incident, opacity: 0.12 },
      label: { color: palette.text, fontSize: 11, position: 'insideTopLeft' },
      data: (data.incidents ?? []).map((span) => [{ xAxis: span.startMs, name: span.label }, { xAxis: span.endMs ?? endMs }]),
    },
  };
}

function forecastSeries(data: ReadingChartData, unit: TemperatureUnit, palette: ChartPalette) {
  const forecast = data.forecast;
  if (!forecast) return [];
  const toUnit = converter(unit);
  return [
    {
      name: 'Forecast',
      type: 'line',
      symbol: 'circle',
      symbolSize: 6,
      lineStyle: { type: 'dotted', width: 2, color: palette.limit },
      itemStyle: { color: palette.limit },
      data: [
        [forecast.fromMs, toUnit(forecast.fromC)],
        [forecast.crossingMs, toUnit(forecast.limitC)],
      ],
    },
  ];
}

function firstTimeMs(data: ReadingChartData): number {
  let first = Infinity;
  for (const series of Object.values(data.probes)) {
    const point = series?.points[0];
    if (point && point[0] < first) first = point[0];
  }
  return Number.isFinite(first) ? first : 0;
}

type TooltipParam = { seriesName?: string; marker?: string; value?: unknown };

/** The tooltip lists the probes and the forecast at the hovered time, in the given zone. */
function tooltipFormatter(unit: TemperatureUnit, timeZone: string | null) {
  return (params: TooltipParam | TooltipParam[]) => {
    const list = (Array.isArray(params) ? params : [params]).filter((p) => Array.isArray(p.value) && !p.seriesName?.endsWith(' range'));
    const atMs = (list[0]?.value as [number, number] | undefined)?.[0];
    if (atMs === undefined) return '';
    const lines = list.map((p) => `${p.marker ?? ''}${p.seriesName}: ${(p.value as [number, number])[1]} °${unit}`);
    return [tooltipTime(atMs, timeZone), ...lines].join('<br/>');
  };
}

function lastTimeMs(data: ReadingChartData): number {
  let last = 0;
  for (const series of Object.values(data.probes)) {
    const point = series?.points[series.points.length - 1];
    if (point && point[0] > last) last = point[0];
  }
  return Math.max(last, data.forecast?.crossingMs ?? 0);
}

/**
 * The whole echarts option for the reading chart: pure, so specs check it directly.
 * Times are labelled in `timeZone` (an IANA name; null: the browser's own).
 */
export function buildChartOptions(data: ReadingChartData, unit: TemperatureUnit, palette: ChartPalette, timeZone: string | null = null): EChartsCoreOption {
  const probes = (['fresh_food', 'freezer'] as const).filter((probe) => data.probes[probe]?.points.length);
  const series = [
    ...probes.flatMap((probe) => (data.probes[probe]!.envelope ? envelopeSeries(probe, data.probes[probe]!.envelope!, unit, palette) : [])),
    ...probes.map((probe) => probeSeries(probe, data, unit, palette, probe === 'fresh_food' || probes.length === 1)),
    incidentSeries(data, palette, lastTimeMs(data)),
    ...forecastSeries(data, unit, palette),
  ];
  return {
    animation: false,
    textStyle: { fontFamily: 'Roboto, sans-serif', color: palette.text },
    grid: { left: 48, right: 24, top: 36, bottom: 72 },
    legend: { top: 0, data: [...probes.map((p) => PROBE_LABEL[p]), ...(data.forecast ? ['Forecast'] : [])], textStyle: { color: palette.text } },
    tooltip: { trigger: 'axis', formatter: tooltipFormatter(unit, timeZone) },
    xAxis: { type: 'time', axisLabel: { color: palette.text, hideOverlap: true, formatter: axisLabelFormatter(lastTimeMs(data) - firstTimeMs(data), timeZone) }, splitLine: { show: false } },
    yAxis: { type: 'value', scale: true, name: `°${unit}`, axisLabel: { color: palette.text }, splitLine: { lineStyle: { color: palette.grid, opacity: 0.4 } } },
    dataZoom: [{ type: 'inside', filterMode: 'none' }, { type: 'slider', height: 24, bottom: 16, filterMode: 'none' }],
    series,
  };
}
