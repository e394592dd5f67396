/**
 * Rows as CSV (RFC 4180: comma separated, CRLF line ends, as the library's timer-table CSV).
 * Numbers are written in full (JavaScript's shortest round-trip form). A text cell beginning
 * with `=`, `+`, `-`, `@`, a tab or a carriage return gets a leading single quote so a
 * spreadsheet shows it as text (CSV formula injection; common practice, OWASP guidance, from
 * memory); a cell with a comma, quote or line break is quoted.
 */
export function toCsv(rows: readonly (readonly (string | number | boolean | null)[])[]): string {
  return rows.map((row) => row.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

function csvCell(value: string | number | boolean | null): string {
  if (value === null) return '';
  if (typeof value !== 'string') return String(value);
  const safe = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}
