// The export files' CSV writer (csv-stringify behind exports/csv.ts) against RFC 4180
// (IETF, "Common Format and MIME Type for CSV Files", 2005, section 2) and read back with
// csv-parse, an independent reader.
import { describe, it, expect } from 'vitest';
import { parse } from 'csv-parse/sync';
import { toCsv } from '../../server/src/modules/exports/csv.js';

describe('toCsv', () => {
  it('ends every record with CRLF and quotes only fields with a comma, quote or line break (RFC 4180 §2.1, 2.6, 2.7)', () => {
    const csv = toCsv(['id', 'note'], [['a1', 'plain'], ['a2', 'north, by the lane'], ['a3', 'the "big" gate'], ['a4', 'two\nlines']]);
    expect(csv).toBe('id,note\r\na1,plain\r\na2,"north, by the lane"\r\na3,"the ""big"" gate"\r\na4,"two\nlines"\r\n');
    expect(parse(csv, { columns: true })).toEqual([
      { id: 'a1', note: 'plain' }, { id: 'a2', note: 'north, by the lane' }, { id: 'a3', note: 'the "big" gate' }, { id: 'a4', note: 'two\nlines' },
    ]);
  });

  it('writes empty fields for missing values and true/false for booleans', () => {
    expect(toCsv(['a', 'b', 'c', 'd'], [[null, undefined, true, false], [0, 2.5, '', 'x']])).toBe('a,b,c,d\r\n,,true,false\r\n0,2.5,,x\r\n');
  });

  it('keeps a spreadsheet from running text as a formula (OWASP, "CSV Injection")', () => {
    const csv = toCsv(['note'], [['=1+2'], ['+1'], ['-3 colonies'], ['@home'], ['ok']]);
    expect((parse(csv, { columns: true }) as Array<{ note: string }>).map((r) => r.note)).toEqual(["'=1+2", "'+1", "'-3 colonies", "'@home", 'ok']);
    // Numbers are numbers, not text: a negative count is not prefixed.
    expect(toCsv(['n'], [[-3]])).toBe('n\r\n-3\r\n');
  });
});
