import { LoggerFileError, parseLoggerCsv } from '../../server/detection/logger-csv';
import { parseTimestampMs } from '../../server/detection/timestamp';

const at = (iso: string) => Date.parse(iso);

describe('logger CSV reader', () => {
  it('reads °C columns and ISO 8601 timestamps with offsets into UTC', () => {
    const { series } = parseLoggerCsv('timestamp,fresh_food_c,freezer_c\n2025-03-01T10:00:00+02:00,3.5,-18.25\n2025-03-01T08:05:00Z,3.6,-18\n');
    expect([...series.atMs]).toEqual([at('2025-03-01T08:00:00Z'), at('2025-03-01T08:05:00Z')]);
    expect([...series.freshFoodC]).toEqual([3.5, 3.6]);
    expect([...series.freezerC]).toEqual([-18.25, -18]);
  });

  it('converts °F columns exactly: 40 °F = 4.444… °C and 0 °F = −17.777… °C (NIST SP 811, B.8)', () => {
    const { series, report } = parseLoggerCsv('timestamp,fresh_food_f,freezer_f\n1740823200000,40,0\n');
    expect(report.temperatureUnit).toBe('F');
    expect(series.freshFoodC[0]).toBeCloseTo(4.444444444, 8);
    expect(series.freezerC[0]).toBeCloseTo(-17.777777778, 8);
  });

  it('sorts unsorted rows and merges duplicated timestamps', () => {
    const text = [
      'timestamp,fresh_food_c,freezer_c',
      '2025-03-01T00:10:00Z,3.0,',
      '2025-03-01T00:00:00Z,2.0,-18',
      '2025-03-01T00:10:00Z,9.9,-17.5',
      '2025-03-01T00:05:00Z,2.5,-18.5',
      '2025-03-01T00:00:00Z,2.0,-18',
    ].join('\n');
    const { series, report } = parseLoggerCsv(text);
    expect([...series.atMs].map((t) => new Date(t).toISOString().slice(11, 16))).toEqual(['00:00', '00:05', '00:10']);
    // The first value of each probe wins; a blank cell is filled from the duplicate.
    expect(series.freshFoodC[2]).toBe(3.0);
    expect(series.freezerC[2]).toBe(-17.5);
    expect(report.duplicatesMerged).toBe(2);
  });

  it('treats an empty cell as a missing reading and counts unreadable cells and rows', () => {
    const { series, report } = parseLoggerCsv('timestamp,fresh_food_c\r\n2025-03-01T00:00:00Z,\r\nnot a time,3\r\n2025-03-01T00:05:00Z,abc\r\n');
    expect(series.atMs.length).toBe(2);
    expect(Number.isNaN(series.freshFoodC[0])).toBeTrue();
    expect(report.rowsSkipped).toBe(1);
    expect(report.cellsUnreadable).toBe(1);
    expect(series.hasFreezer).toBeFalse();
  });

  it('accepts a byte-order mark, quoted headers and CRLF line ends', () => {
    const { series } = parseLoggerCsv('\uFEFF"Timestamp","Freezer_C"\r\n2025-03-01T00:00:00.500Z,-20.0625\r\n');
    expect(series.atMs[0]).toBe(at('2025-03-01T00:00:00.500Z'));
    expect(series.freezerC[0]).toBe(-20.0625);
  });

  it('rejects a file it cannot read with a one-line message', () => {
    expect(() => parseLoggerCsv('')).toThrowError(LoggerFileError, /empty/);
    expect(() => parseLoggerCsv('time,fresh_food_c\n1,2\n')).toThrowError(LoggerFileError, /timestamp/);
    expect(() => parseLoggerCsv('timestamp,humidity\n1,2\n')).toThrowError(LoggerFileError, /temperature column/);
    expect(() => parseLoggerCsv('timestamp,fresh_food_c\nyesterday,3\n')).toThrowError(LoggerFileError, /readable timestamp/);
  });
});

describe('timestamps', () => {
  it('agrees with Date.parse on ISO 8601 forms with offsets', () => {
    for (const text of ['2025-07-01T12:34:56Z', '2025-07-01T12:34:56.789+05:30', '2025-12-31T23:59-08:00', '2024-02-29T00:00:00+0100']) {
      expect(parseTimestampMs(text)).withContext(text).toBe(Date.parse(text.replace('+0100', '+01:00')));
    }
  });

  it('reads epoch milliseconds and flags a time without offset (read as UTC)', () => {
    expect(parseTimestampMs('1740823200000')).toBe(1740823200000);
    const flag = { withoutOffset: false };
    expect(parseTimestampMs('2025-03-01 10:00:00', flag)).toBe(at('2025-03-01T10:00:00Z'));
    expect(flag.withoutOffset).toBeTrue();
  });
});
