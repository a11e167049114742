// CSV text (RFC 4180): fields quoted when they hold a comma, quote or line break; a cell
// starting with = + - @ is prefixed with ' so spreadsheets do not run it as a formula.
type Cell = string | number;

function cell(value: Cell): string {
  let text = String(value);
  if (typeof value === 'string' && /^[=+\-@]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(header: string[], rows: Cell[][]): string {
  return [header, ...rows].map((row) => row.map(cell).join(',')).join('\r\n') + '\r\n';
}
