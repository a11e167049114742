// CSV text (RFC 4180, csv-stringify): fields quoted when they hold a comma, quote or line
// break; a cell starting with = + - @ is prefixed with ' so spreadsheets do not run it as
// a formula.
import { stringify } from 'csv-stringify/sync';

type Cell = string | number;

const defused = (value: Cell): Cell => (typeof value === 'string' && /^[=+\-@]/.test(value) ? `'${value}` : value);

export function toCsv(header: string[], rows: Cell[][]): string {
  // quoted_match: a lone CR or LF is quoted too, not only the CRLF that ends a record.
  return stringify([header, ...rows.map((row) => row.map(defused))], { record_delimiter: 'windows', quoted_match: /[\r\n]/ });
}
