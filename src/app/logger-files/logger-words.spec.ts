import type { LoggerFinding } from '../../../shared/api/logger-files';
import { mergedSpans } from './logger-words';

const HOUR_MS = 3_600_000;

function finding(kind: LoggerFinding['kind'], startHour: number, endHour: number | null, compartment: LoggerFinding['compartment'] = 'fresh_food'): LoggerFinding {
  return {
    kind,
    compartment,
    started_at: new Date(startHour * HOUR_MS).toISOString(),
    detected_at: new Date(startHour * HOUR_MS).toISOString(),
    ended_at: endHour === null ? null : new Date(endHour * HOUR_MS).toISOString(),
    severity: 'urgent',
    probable_causes: [],
    minutes_above_4c: 0,
    summary: '',
  };
}

describe('mergedSpans', () => {
  it('merges overlapping findings into one shaded band naming each kind once', () => {
    const spans = mergedSpans([
      finding('warming-trend', 2, 10),
      finding('over-temperature', 4, 9),
      finding('over-temperature', 5, 12, 'freezer'),
      finding('sensor-fault', 1, 30),
      finding('warming-trend', 40, 44),
      finding('no-cooling', 50, null),
      finding('over-temperature', 60, 61),
    ]);
    expect(spans).toEqual([
      { startMs: 2 * HOUR_MS, endMs: 12 * HOUR_MS, label: 'Warming trend (fresh food), over temperature (fresh food), over temperature (freezer)' },
      { startMs: 40 * HOUR_MS, endMs: 44 * HOUR_MS, label: 'Warming trend (fresh food)' },
      // Still open at the end of the file: everything after it belongs to the same band.
      { startMs: 50 * HOUR_MS, endMs: null, label: 'No cooling (fresh food), over temperature (fresh food)' },
    ]);
  });

  it('keeps separate episodes apart', () => {
    expect(mergedSpans([finding('no-cooling', 0, 1), finding('no-cooling', 2, 3)])!.length).toBe(2);
  });
});
