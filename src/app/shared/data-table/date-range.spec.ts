import { openedRange } from './date-range';

describe('openedRange', () => {
  it('turns days into instants in the user’s zone, the last day included', () => {
    // Chicago is UTC-5 in summer (CDT) and UTC-6 in winter (CST).
    expect(openedRange('2026-07-01', '2026-07-01', 'America/Chicago')).toEqual({ openedFrom: '2026-07-01T05:00:00.000Z', openedTo: '2026-07-02T05:00:00.000Z' });
    expect(openedRange('2026-01-31', '2026-01-31', 'America/Chicago')).toEqual({ openedFrom: '2026-01-31T06:00:00.000Z', openedTo: '2026-02-01T06:00:00.000Z' });
  });

  it('spans a daylight-saving change: the day clocks fall back is 25 hours long', () => {
    // US clocks fell back on 2026-11-01 (the first Sunday of November).
    const { openedFrom, openedTo } = openedRange('2026-11-01', '2026-11-01', 'America/Chicago');
    expect(Date.parse(openedTo!) - Date.parse(openedFrom!)).toBe(25 * 3_600_000);
  });

  it('leaves out a side that is empty or not a day', () => {
    expect(openedRange('', 'yesterday', 'UTC')).toEqual({ openedFrom: undefined, openedTo: undefined });
  });
});
