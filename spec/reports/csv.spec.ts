import { csvField, toCsv } from '../../server/services/reports-csv';
import { localDate, monthStartBefore } from '../../server/services/reports-range';

describe('report CSV', () => {
  // RFC 4180, section 2: fields with commas, double quotes or line breaks are enclosed in
  // double quotes (rule 6); a double quote inside is escaped by another one (rule 7).
  it('quotes as RFC 4180 says', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('cr\rhere')).toBe('"cr\rhere"');
    expect(csvField(null)).toBe('');
    expect(csvField(12.5)).toBe('12.5');
  });

  // OWASP "CSV Injection": cells starting with =, +, -, @, tab or carriage return are
  // prefixed with a single quote so a spreadsheet shows them as text.
  it('guards text that a spreadsheet would run as a formula, but not numbers', () => {
    expect(csvField('=SUM(A1:A9)')).toBe(`'=SUM(A1:A9)`);
    expect(csvField('+1')).toBe(`'+1`);
    expect(csvField('-2+3')).toBe(`'-2+3`);
    expect(csvField('@cmd')).toBe(`'@cmd`);
    expect(csvField('\tx')).toBe(`'\tx`);
    expect(csvField(`=HYPERLINK("http://x.example.com","y")`)).toBe(`"'=HYPERLINK(""http://x.example.com"",""y"")"`);
    expect(csvField(-5)).toBe('-5');
    expect(csvField('a=b')).toBe('a=b');
  });

  it('ends every record, the last too, with CRLF', () => {
    expect(toCsv({ header: ['a', 'b'], rows: [[1, 'x'], [null, 'y,z']] })).toBe('a,b\r\n1,x\r\n,"y,z"\r\n');
  });
});

describe('report range', () => {
  it('reads today in the manager’s zone', () => {
    // 2026-03-02T03:00Z is still March 1 in Chicago (UTC−6).
    expect(localDate(Date.parse('2026-03-02T03:00:00Z'), 'America/Chicago')).toBe('2026-03-01');
    expect(localDate(Date.parse('2026-03-02T03:00:00Z'), 'UTC')).toBe('2026-03-02');
  });

  it('counts months back across a year', () => {
    expect(monthStartBefore('2026-03-02', 11)).toBe('2025-04-01');
    expect(monthStartBefore('2026-01-31', 0)).toBe('2026-01-01');
    expect(monthStartBefore('2026-01-31', 1)).toBe('2025-12-01');
    expect(monthStartBefore('2026-12-31', 12)).toBe('2025-12-01');
  });
});
