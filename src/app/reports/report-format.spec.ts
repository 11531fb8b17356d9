import { causeLabel, formatDuration, formatRate, monthLabel } from './report-format';

describe('report words', () => {
  it('writes durations in their two largest units', () => {
    expect(formatDuration(null)).toBe('—');
    expect(formatDuration(45)).toBe('45 min');
    expect(formatDuration(190)).toBe('3 h 10 min');
    expect(formatDuration(120)).toBe('2 h');
    expect(formatDuration(1830)).toBe('1 d 6 h');
    expect(formatDuration(4320)).toBe('3 d');
  });

  it('writes a rate as a whole percent', () => {
    expect(formatRate(0.3333)).toBe('33 %');
    expect(formatRate(1)).toBe('100 %');
    expect(formatRate(null)).toBe('—');
  });

  it('names causes, months and the cases without a code', () => {
    expect(causeLabel('evaporator-fan')).toBe('evaporator fan');
    expect(causeLabel('other')).toBe('other (found on site)');
    expect(causeLabel('unknown')).toBe('not known yet');
    expect(monthLabel('2026-01')).toBe('Jan 2026');
  });
});
