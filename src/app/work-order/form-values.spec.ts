import { isoToWallTime, parseMoneyToCents, wallTimeToIso } from './form-values';

describe('parseMoneyToCents', () => {
  it('reads amounts to the cent without floating-point drift', () => {
    expect(parseMoneyToCents('182.25')).toBe(18225);
    expect(parseMoneyToCents('0.29')).toBe(29); // 0.29 * 100 is 28.999… in binary floating point
    expect(parseMoneyToCents('$9.5')).toBe(950);
    expect(parseMoneyToCents('1,250')).toBe(125000);
    expect(parseMoneyToCents('12')).toBe(1200);
  });

  it('refuses what is not money', () => {
    for (const text of ['', 'abc', '1.234', '-5', '1,23', '12.']) expect(parseMoneyToCents(text)).withContext(text).toBeNull();
  });
});

describe('wall times on the property’s clocks', () => {
  it('reads a visit time in the property’s zone, daylight saving time included', () => {
    // America/Chicago is UTC−6 in winter (CST) and UTC−5 in summer (CDT); IANA tz database.
    expect(wallTimeToIso('2026-01-15T09:00', 'America/Chicago')).toBe('2026-01-15T15:00:00.000Z');
    expect(wallTimeToIso('2026-07-15T09:00', 'America/Chicago')).toBe('2026-07-15T14:00:00.000Z');
    expect(wallTimeToIso('not a time', 'America/Chicago')).toBeNull();
  });

  it('writes an instant back as the same wall time', () => {
    expect(isoToWallTime(Date.parse('2026-07-15T14:00:00Z'), 'America/Chicago')).toBe('2026-07-15T09:00');
    expect(isoToWallTime(Date.parse('2026-01-15T15:00:00Z'), 'UTC')).toBe('2026-01-15T15:00');
  });
});
