/**
 * echarts options of the reports' two charts, built from the API's response: incidents per
 * 100 appliances per month (bars, with the counts behind each in the tooltip) and the top
 * causes (horizontal bars by requests or by spend).
 */
import type { EChartsCoreOption } from 'echarts/core';
import type { CauseFigures, IncidentRateMonth } from '../../../shared/api/reports';
import { formatMoney } from '../appliance/money';
import type { ChartPalette } from '../shared/reading-chart/chart-data';
import { causeLabel, monthLabel } from './report-format';

export type CauseMetric = 'requests' | 'spend';

/** The currency most of the causes' spend is in; the spend chart shows that one. */
export function mainCurrency(causes: readonly CauseFigures[]): string | null {
  const totals = new Map<string, number>();
  for (const money of causes.flatMap((cause) => cause.spend)) totals.set(money.currency, (totals.get(money.currency) ?? 0) + money.cents);
  return [...totals.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]))[0]?.[0] ?? null;
}

function axisStyle(palette: ChartPalette) {
  return { axisLabel: { color: palette.text }, axisLine: { lineStyle: { color: palette.grid } }, splitLine: { lineStyle: { color: palette.grid } } };
}

export function incidentRateOptions(months: readonly IncidentRateMonth[], palette: ChartPalette): EChartsCoreOption {
  return {
    animation: false,
    grid: { left: 44, right: 12, top: 16, bottom: 32 },
    tooltip: {
      trigger: 'axis',
      formatter: (items: { dataIndex: number }[]) => {
        const month = months[items[0]?.dataIndex ?? 0];
        if (!month) return '';
        const rate = month.per100Appliances === null ? 'no appliance in service' : `${month.per100Appliances} per 100 appliances`;
        return `${monthLabel(month.month)}<br>${rate}<br>${month.incidents} incident${month.incidents === 1 ? '' : 's'}, ${month.appliancesInService} in service`;
      },
    },
    xAxis: { type: 'category', data: months.map((month) => monthLabel(month.month)), ...axisStyle(palette), splitLine: { show: false } },
    yAxis: { type: 'value', name: 'per 100', nameTextStyle: { color: palette.text }, minInterval: 1, ...axisStyle(palette) },
    series: [
      {
        name: 'Incidents per 100 appliances',
        type: 'bar',
        itemStyle: { color: palette.freezer, borderRadius: [4, 4, 0, 0] },
        data: months.map((month) => month.per100Appliances ?? 0),
      },
    ],
  };
}

function spendIn(cause: CauseFigures, currency: string | null): number {
  return cause.spend.find((money) => money.currency === currency)?.cents ?? 0;
}

/** Largest at the top: echarts draws a category y axis from the bottom, so the order is reversed. */
export function topCausesOptions(causes: readonly CauseFigures[], metric: CauseMetric, palette: ChartPalette): EChartsCoreOption {
  const currency = mainCurrency(causes);
  const value = (cause: CauseFigures) => (metric === 'requests' ? cause.requests : spendIn(cause, currency));
  const shown = [...causes].sort((a, b) => value(b) - value(a)).slice(0, 8).reverse();
  const label = (cents: number) => (currency ? formatMoney(cents, currency) : '');
  return {
    animation: false,
    // Room for the cause names: echarts 6's form of the old containLabel.
    grid: { left: 8, right: 24, top: 8, bottom: 24, outerBoundsMode: 'same', outerBoundsContain: 'axisLabel' },
    tooltip: {
      trigger: 'axis',
      axisPointer: { type: 'shadow' },
      formatter: (items: { dataIndex: number }[]) => {
        const cause = shown[items[0]?.dataIndex ?? 0];
        if (!cause) return '';
        const spend = cause.spend.map((money) => formatMoney(money.cents, money.currency)).join(' + ') || 'no spend';
        return `${causeLabel(cause.cause)}<br>${cause.requests} request${cause.requests === 1 ? '' : 's'} (${cause.foundOnSite} found on site)<br>${spend}`;
      },
    },
    xAxis: {
      type: 'value',
      minInterval: metric === 'requests' ? 1 : undefined,
      ...axisStyle(palette),
      axisLabel: { color: palette.text, formatter: metric === 'spend' ? (cents: number) => label(cents) : undefined },
    },
    yAxis: { type: 'category', data: shown.map((cause) => causeLabel(cause.cause)), ...axisStyle(palette), splitLine: { show: false } },
    series: [
      {
        name: metric === 'requests' ? 'Requests' : `Spend (${currency ?? 'none'})`,
        type: 'bar',
        itemStyle: { color: metric === 'requests' ? palette.freezer : palette.limit, borderRadius: [0, 4, 4, 0] },
        data: shown.map(value),
      },
    ],
  };
}
