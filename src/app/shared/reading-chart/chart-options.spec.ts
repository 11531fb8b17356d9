import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../../../shared/temperature';
import type { ChartPalette, ReadingChartData } from './chart-data';
import { buildChartOptions } from './chart-options';

const palette: ChartPalette = { freshFood: '#0a0', freezer: '#00a', limit: '#fa0', incident: '#f00', text: '#333', grid: '#ccc' };
const hourMs = 3_600_000;

const data: ReadingChartData = {
  probes: {
    fresh_food: { points: [[0, 3], [hourMs, 3.5], [2 * hourMs, 6]], envelope: null },
    freezer: { points: [[0, -18], [hourMs, -17.5], [2 * hourMs, -16]], envelope: [[0, -19, -17], [hourMs, -18, -17]] },
  },
  incidents: [{ startMs: hourMs, endMs: null, label: 'Evaporator fan' }],
  defrosts: [{ atMs: hourMs + 60_000, probe: 'freezer' }],
  forecast: { probe: 'fresh_food', fromMs: 2 * hourMs, fromC: 6, crossingMs: 5 * hourMs, limitC: 10 },
};

type Series = { name: string; data: [number, number][]; markLine?: { data: { yAxis: number }[] }; markArea?: { data: unknown[] }; markPoint?: { data: { coord: number[] }[] } };
const seriesOf = (option: Record<string, unknown>) => option['series'] as Series[];
const byName = (option: Record<string, unknown>, name: string) => seriesOf(option).find((s) => s.name === name)!;

describe('buildChartOptions', () => {
  it('draws both probes on one time axis in °C', () => {
    const option = buildChartOptions(data, 'C', palette) as Record<string, unknown>;
    expect((option['xAxis'] as { type: string }).type).toBe('time');
    expect(byName(option, 'Fresh food').data).toEqual([[0, 3], [hourMs, 3.5], [2 * hourMs, 6]]);
    expect(byName(option, 'Freezer').data[0]).toEqual([0, -18]);
  });

  it('converts to °F exactly (NIST SP 811: °F = °C × 9/5 + 32) and draws the 40 °F and 0 °F limits (FDA)', () => {
    const option = buildChartOptions(data, 'F', palette) as Record<string, unknown>;
    expect(byName(option, 'Fresh food').data[0]).toEqual([0, 37.4]);
    expect(byName(option, 'Fresh food').markLine!.data[0]!.yAxis).toBe(40);
    expect(byName(option, 'Freezer').markLine!.data[0]!.yAxis).toBe(0);
  });

  it('shades only the fresh-food unsafe band when both probes share the axis', () => {
    const option = buildChartOptions(data, 'C', palette) as Record<string, unknown>;
    expect(byName(option, 'Fresh food').markArea).toBeDefined();
    expect(byName(option, 'Freezer').markArea).toBeUndefined();
    const freezerOnly = buildChartOptions({ probes: { freezer: data.probes.freezer } }, 'C', palette) as Record<string, unknown>;
    expect(byName(freezerOnly, 'Freezer').markArea).toBeDefined();
    expect(byName(freezerOnly, 'Freezer').markLine!.data[0]!.yAxis).toBe(Math.round(FREEZER_LIMIT_C * 10) / 10);
    expect(Math.round(FRESH_FOOD_LIMIT_C * 10) / 10).toBe(4.4);
  });

  it('stacks the min/max envelope as a floor and a band of (max − min)', () => {
    const option = buildChartOptions(data, 'C', palette) as Record<string, unknown>;
    const [floor, band] = seriesOf(option).filter((s) => s.name === 'Freezer range');
    expect(floor!.data).toEqual([[0, -19], [hourMs, -18]]);
    expect(band!.data).toEqual([[0, 2], [hourMs, 1]]);
  });

  it('shades an open incident to the end of the range and marks defrosts on their probe', () => {
    const option = buildChartOptions(data, 'C', palette) as Record<string, unknown>;
    const incidentAreas = byName(option, 'Incidents').markArea!.data as [{ xAxis: number; name: string }, { xAxis: number }][];
    expect(incidentAreas[0]![0]).toEqual({ xAxis: hourMs, name: 'Evaporator fan' });
    expect(incidentAreas[0]![1].xAxis).toBe(5 * hourMs);
    expect(byName(option, 'Freezer').markPoint!.data[0]!.coord).toEqual([hourMs, -17.5]);
    expect(byName(option, 'Fresh food').markPoint).toBeUndefined();
  });

  it('draws the forecast from the last reading to the limit crossing', () => {
    const option = buildChartOptions(data, 'C', palette) as Record<string, unknown>;
    expect(byName(option, 'Forecast').data).toEqual([[2 * hourMs, 6], [5 * hourMs, 10]]);
  });

  it('labels the time axis and the tooltip in the property’s time zone, daylight saving time included', () => {
    type Axis = { axisLabel: { formatter: (valueMs: number) => string } };
    const newYork = buildChartOptions(data, 'C', palette, 'America/New_York') as Record<string, unknown>;
    const label = (newYork['xAxis'] as Axis).axisLabel.formatter;
    // America/New_York is UTC−5 in winter (EST) and UTC−4 in summer (EDT) (IANA time zone database).
    expect(label(Date.parse('2026-03-02T15:00:00Z'))).toBe('10:00');
    expect(label(Date.parse('2026-07-01T15:00:00Z'))).toBe('11:00');
    const tokyo = buildChartOptions(data, 'C', palette, 'Asia/Tokyo') as Record<string, unknown>;
    expect((tokyo['xAxis'] as Axis).axisLabel.formatter(Date.parse('2026-03-02T15:00:00Z'))).toBe('00:00');
    const tooltip = (newYork['tooltip'] as { formatter: (params: unknown) => string }).formatter([
      { seriesName: 'Fresh food', marker: '', value: [Date.parse('2026-03-02T15:00:00Z'), 3.5] },
      { seriesName: 'Fresh food range', marker: '', value: [Date.parse('2026-03-02T15:00:00Z'), 1] },
    ]);
    expect(tooltip).toBe('Mar 2, 2026, 10:00 EST<br/>Fresh food: 3.5 °C');
  });

  it('labels a long range by day, and a year by month', () => {
    type Axis = { axisLabel: { formatter: (valueMs: number) => string } };
    const week = { probes: { fresh_food: { points: [[0, 3], [7 * 24 * hourMs, 3]] as [number, number][], envelope: null } } };
    const year = { probes: { fresh_food: { points: [[0, 3], [365 * 24 * hourMs, 3]] as [number, number][], envelope: null } } };
    const at = Date.parse('2026-03-02T15:00:00Z');
    expect(((buildChartOptions(week, 'C', palette, 'UTC') as Record<string, unknown>)['xAxis'] as Axis).axisLabel.formatter(at)).toBe('Mar 2');
    expect(((buildChartOptions(year, 'C', palette, 'UTC') as Record<string, unknown>)['xAxis'] as Axis).axisLabel.formatter(at)).toBe('Mar 2026');
  });
});
