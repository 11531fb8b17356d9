/**
 * CSV cells by hand, read back with csv-parse (an independent RFC 4180 reader): quoting
 * per RFC 4180 section 2, and the formula guard of OWASP "CSV Injection".
 */
import { parse } from 'csv-parse/sync';
import { csvCell, csvRecord, guardFormula, toCsv } from '../../server/exports/csv';

describe('CSV writing', () => {
  it('quotes only fields that need it and doubles inner quotes (RFC 4180, section 2)', () => {
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell(' padded ')).withContext('spaces kept visible to readers that trim').toBe('" padded "');
    expect(csvCell(null)).toBe('');
    expect(csvCell(undefined)).toBe('');
    expect(csvCell(-12.5)).withContext('numbers we wrote are data').toBe('-12.5');
    expect(csvRecord(['a', 'b'])).toBe('a,b\r\n');
  });

  it('prefixes cells a spreadsheet would run as a formula (OWASP CSV Injection)', () => {
    for (const start of ['=', '+', '-', '@', '\t', '\r']) expect(guardFormula(`${start}1+1`)).withContext(JSON.stringify(start)).toBe(`'${start}1+1`);
    expect(guardFormula('1+1')).toBe('1+1');
    expect(csvCell('=SUM(A1:A9),x')).toBe(`"'=SUM(A1:A9),x"`);
  });

  it('round-trips awkward values through an independent reader', () => {
    const rows = [{ text: 'Cool "Max", 18' }, { text: 'line one\r\nline two' }, { text: '=HYPERLINK("http://example.com")' }, { text: 'émigré °F' }];
    const text = toCsv([{ label: 'Text', value: (row: { text: string }) => row.text }], rows);
    expect(parse(text) as string[][]).toEqual([['Text'], ['Cool "Max", 18'], ['line one\r\nline two'], [`'=HYPERLINK("http://example.com")`], ['émigré °F']]);
  });
});
