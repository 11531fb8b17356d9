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
});
