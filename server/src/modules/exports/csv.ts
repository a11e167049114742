// Writes rows as CSV (RFC 4180): every field quoted when it holds a comma, quote or line
// break; lines end with CRLF. Fields starting with = + - @ are prefixed with ' so a
// spreadsheet does not run them as formulas.
export function toCsv(header: string[], rows: Array<Array<string | number | boolean | null | undefined>>): string {
  const cell = (value: string | number | boolean | null | undefined) => {
    if (value == null) return '';
    let text = String(value);
    if (typeof value === 'string' && /^[=+\-@]/.test(text)) text = `'${text}`;
    return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
  };
  return [header, ...rows].map((row) => row.map(cell).join(',')).join('\r\n') + '\r\n';
}
