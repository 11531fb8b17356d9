import { maxPointsFor, rangeOf, resolutionWords } from './history-range';

describe('history ranges', () => {
  const nowMs = Date.parse('2026-03-02T15:00:00Z');

  it('ends a preset now and spans its length', () => {
    expect(rangeOf({ kind: 'preset', key: '6h' }, nowMs)).toEqual({ fromMs: nowMs - 6 * 3_600_000, toMs: nowMs });
    expect(rangeOf({ kind: 'preset', key: '1y' }, nowMs).fromMs).toBe(nowMs - 365 * 86_400_000);
    expect(rangeOf({ kind: 'custom', fromMs: 1, toMs: 2 }, nowMs)).toEqual({ fromMs: 1, toMs: 2 });
  });

  it('asks for about two points per pixel, within what the history API serves', () => {
    expect(maxPointsFor(375)).toBe(750);
    expect(maxPointsFor(50)).toBe(200);
    expect(maxPointsFor(4000)).toBe(2000);
  });

  it('says in words which resolution the server chose', () => {
    expect(resolutionWords({ resolution: 'raw', source: 'reading', bucketMs: null })).toBe('every reading');
    expect(resolutionWords({ resolution: 'rollup', source: 'rollup_5m', bucketMs: 300_000 })).toBe('5-minute means with their min–max band');
    expect(resolutionWords({ resolution: 'rollup', source: 'rollup_1h', bucketMs: 6 * 3_600_000 })).toBe('6-hour means with their min–max band');
    expect(resolutionWords({ resolution: 'rollup', source: 'rollup_1h', bucketMs: 86_400_000 })).toBe('1-day means with their min–max band');
  });
});
