import type { ChartPalette } from '../shared/reading-chart/chart-data';
import { incidentRateOptions, mainCurrency, topCausesOptions } from './report-charts';
import { sampleReport } from './reports-fixtures';

const palette: ChartPalette = { freshFood: '#0a0', freezer: '#00a', limit: '#fa0', incident: '#f00', text: '#333', grid: '#ccc' };

type Options = Record<string, unknown>;
type Series = { type: string; name: string; data: number[]; itemStyle: { color: string } };
const seriesOf = (options: Options) => options['series'] as Series[];
const axis = (options: Options, name: 'xAxis' | 'yAxis') => options[name] as { type: string; data?: string[] };
const tooltip = (options: Options) => (options['tooltip'] as { formatter: (items: { dataIndex: number }[]) => string }).formatter;

describe('report chart options', () => {
  const report = sampleReport();

  it('draws incidents per 100 appliances as one bar per month, a month without appliances as zero', () => {
    const options = incidentRateOptions(report.incidentRate, palette) as Options;
    expect(axis(options, 'xAxis')).toEqual(jasmine.objectContaining({ type: 'category', data: ['Dec 2025', 'Jan 2026', 'Feb 2026'] }));
    const [bars] = seriesOf(options);
    expect(bars.type).toBe('bar');
    expect(bars.data).toEqual([20, 33.33, 0]);
    expect(bars.itemStyle.color).toBe('#00a');
    expect(tooltip(options)([{ dataIndex: 1 }])).toBe('Jan 2026<br>33.33 per 100 appliances<br>2 incidents, 6 in service');
    expect(tooltip(options)([{ dataIndex: 2 }])).toContain('no appliance in service');
  });

  it('ranks causes by requests, the largest at the top', () => {
    const options = topCausesOptions(report.topCauses, 'requests', palette) as Options;
    // echarts draws a category y axis upwards: the last entry is the top bar.
    expect(axis(options, 'yAxis').data).toEqual(['not known yet', 'compressor start', 'evaporator fan']);
    expect(seriesOf(options)[0].data).toEqual([1, 1, 2]);
    expect(tooltip(options)([{ dataIndex: 2 }])).toBe('evaporator fan<br>2 requests (1 found on site)<br>$329.00');
  });

  it('ranks causes by spend in the main currency', () => {
    expect(mainCurrency(report.topCauses)).toBe('USD');
    const options = topCausesOptions(report.topCauses, 'spend', palette) as Options;
    expect(axis(options, 'yAxis').data).toEqual(['not known yet', 'evaporator fan', 'compressor start']);
    const [bars] = seriesOf(options);
    expect(bars.data).toEqual([0, 32900, 45000]);
    expect(bars.name).toBe('Spend (USD)');
    expect(bars.itemStyle.color).toBe('#fa0');
  });

  it('has no currency to show when nothing was spent', () => {
    expect(mainCurrency([{ cause: 'unknown', requests: 1, foundOnSite: 0, spend: [] }])).toBeNull();
  });
});
