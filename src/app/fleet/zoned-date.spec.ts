import { formatZoned, startOfDayInZone, zoneOffsetMs } from './zoned-date';

// Offsets from the IANA time zone database: America/Chicago is UTC−6 (CST) in winter and
// UTC−5 (CDT) in summer; daylight saving time began on 8 March 2026 in the US.
describe('zoned dates', () => {
  it('formats an instant on the property’s clock, not the browser’s', () => {
    expect(formatZoned('2026-03-02T15:00:00Z', 'America/Chicago', 'time')).toBe('09:00 AM');
    expect(formatZoned('2026-03-02T15:00:00Z', 'Asia/Tokyo', 'date-time')).toBe('Mar 3, 2026, 12:00 AM GMT+9');
    expect(formatZoned(null, 'UTC')).toBe('—');
    expect(formatZoned('not a date', 'UTC')).toBe('—');
  });

  it('knows the zone’s offset on each side of a daylight-saving change', () => {
    expect(zoneOffsetMs('America/Chicago', Date.parse('2026-03-02T12:00:00Z'))).toBe(-6 * 3_600_000);
    expect(zoneOffsetMs('America/Chicago', Date.parse('2026-03-09T12:00:00Z'))).toBe(-5 * 3_600_000);
  });

  it('finds the instant a calendar day begins in a zone', () => {
    expect(new Date(startOfDayInZone(2026, 2, 2, 'America/Chicago')).toISOString()).toBe('2026-03-02T06:00:00.000Z');
    expect(new Date(startOfDayInZone(2026, 2, 9, 'America/Chicago')).toISOString()).toBe('2026-03-09T05:00:00.000Z');
    expect(new Date(startOfDayInZone(2026, 2, 3, 'Asia/Tokyo')).toISOString()).toBe('2026-03-02T15:00:00.000Z');
  });
});
