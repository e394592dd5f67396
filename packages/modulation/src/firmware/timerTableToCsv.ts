import { hasAboveSense } from './hasAboveSense.js';
import type { TimerTable } from './timerTableTypes.js';

/**
 * The table as CSV (RFC 4180: comma separated, CRLF line ends, cells with a comma, quote or
 * line break quoted): a header row, then one row per entry with its index, its sampling
 * angle (rad) and, per channel, duty (fraction), compare, highSide and lowSide (counts). A table
 * with entries of compare sense `'above'` (the reduced common-mode methods `azspwm1`, `nspwm`)
 * has a column `<channel>_sense` after `<channel>_compare`, `below` or `above` per entry; the
 * other tables have none (every entry is `below`), so their files are unchanged.
 *
 * Any cell that begins with `=`, `+`, `-`, `@`, a tab or a carriage return is prefixed with a
 * single quote so that a spreadsheet shows it as text instead of evaluating it as a formula
 * (CSV formula injection; common practice, OWASP guidance, from memory). The table's own
 * numbers are never negative, so only text taken from the caller (channel names) can trip it.
 */
export function timerTableToCsv(table: TimerTable): string {
  const withSense = hasAboveSense(table);
  const header = ['entry', 'angle_rad'];
  for (const channel of table.channels) {
    header.push(
      `${channel.name}_duty`,
      `${channel.name}_compare`,
      ...(withSense ? [`${channel.name}_sense`] : []),
      `${channel.name}_high`,
      `${channel.name}_low`,
    );
  }
  const rows = [header];
  table.entryAngles.forEach((angle, i) => {
    const row = [String(i), String(angle)];
    for (const channel of table.channels) {
      row.push(
        String(channel.duty[i]),
        String(channel.compare[i]),
        ...(withSense ? [channel.sense[i] ?? 'below'] : []),
        String(channel.highSide[i]),
        String(channel.lowSide[i]),
      );
    }
    rows.push(row);
  });
  return rows.map((row) => row.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

function csvCell(text: string): string {
  const safe = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}
