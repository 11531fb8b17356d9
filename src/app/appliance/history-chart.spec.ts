import { sampleDetail, sampleHistory } from './appliance-fixtures';
import { chartDataOf, hasReadings } from './history-chart';

describe('chartDataOf', () => {
  const toMs = Date.parse('2026-03-02T15:00:00Z');

  it('shades the incidents and marks the defrosts inside the range, and draws the forecast for a range that ends now', () => {
    const range = { fromMs: toMs - 24 * 3_600_000, toMs };
    const data = chartDataOf(sampleHistory(range.fromMs, range.toMs), sampleDetail(), range);
    expect(data.incidents).toEqual([{ startMs: Date.parse('2026-03-02T05:00:00Z'), endMs: null, label: 'warming trend: condenser fan stopped or condenser coil dirty' }]);
    expect(data.defrosts?.map((d) => new Date(d.atMs).toISOString())).toEqual(['2026-03-02T04:10:00.000Z', '2026-03-02T14:10:00.000Z']);
    expect(data.forecast).toEqual({ probe: 'fresh_food', fromMs: Date.parse('2026-03-02T14:55:00Z'), fromC: 3.6, crossingMs: Date.parse('2026-03-02T21:00:00Z'), limitC: 4.444 });
  });

  it('clips an incident to the range and leaves out what lies outside it', () => {
    const range = { fromMs: Date.parse('2025-11-02T12:00:00Z'), toMs: Date.parse('2025-11-05T00:00:00Z') };
    const data = chartDataOf(sampleHistory(range.fromMs, range.toMs), sampleDetail(), range);
    expect(data.incidents?.map((i) => [i.startMs, i.endMs])).toEqual([[range.fromMs, Date.parse('2025-11-03T10:00:00Z')]]);
    expect(data.defrosts).toEqual([]);
    expect(data.forecast).toBeNull();
  });

  it('knows a range without readings', () => {
    const history = sampleHistory(0, 1);
    expect(hasReadings(history)).toBeTrue();
    expect(hasReadings({ ...history, probes: { fresh_food: { points: [], envelope: null } } })).toBeFalse();
  });
});
