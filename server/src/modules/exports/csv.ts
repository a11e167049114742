// Rows as CSV through csv-stringify (RFC 4180): a field is quoted when it holds a comma,
// quote or line break; lines end with CRLF. Text starting with = + - @ gets a leading '
// so a spreadsheet does not run it as a formula; booleans read true/false.
import { stringify } from 'csv-stringify/sync';

export type CsvCell = string | number | boolean | null | undefined;

export function toCsv(header: string[], rows: CsvCell[][]): string {
  return stringify([header, ...rows], {
    record_delimiter: '\r\n',
    quoted_match: /[\r\n]/,
    cast: { boolean: (value) => String(value), string: (value) => (/^[=+\-@]/.test(value) ? `'${value}` : value) },
  });
}
