import type { MultilevelTimerTable } from './multilevelTimerTableTypes.js';

/**
 * The table as CSV (RFC 4180: comma separated, CRLF line ends): a header row, then one row per
 * entry with its index, each counter's sampling angle (`<counter>_angle_rad`, rad) and, per leg
 * and pair, the main switch's duty (fraction) and ideal compare value, then the main switch's and
 * the complement's compare values (counts), named `<leg>_<switch>_duty`, `<leg>_<switch>_compare`,
 * `<leg>_<switch>` and `<leg>_<complement>` (`leg_a_S1_duty`, `leg_a_S1`, `leg_a_S3`). Names are
 * reduced to letters, digits and `_`, so no cell needs quoting and none can start a spreadsheet
 * formula (CSV formula injection; common practice, OWASP guidance, from memory).
 */
export function multilevelTimerTableToCsv(table: MultilevelTimerTable): string {
  const header = ['entry', ...table.counters.map((c) => `${slug(c.name)}_angle_rad`)];
  for (const leg of table.legs) {
    for (const pair of leg.pairs) {
      const main = `${slug(leg.name)}_${slug(pair.main)}`;
      header.push(
        `${main}_duty`,
        `${main}_compare`,
        main,
        `${slug(leg.name)}_${slug(pair.complement)}`,
      );
    }
  }
  const rows = [header.join(',')];
  for (let i = 0; i < table.parameters.tableLength; i++) {
    const row = [String(i), ...table.counters.map((c) => String(c.entryAngles[i]))];
    for (const leg of table.legs) {
      for (const pair of leg.pairs) {
        row.push(
          String(pair.duty[i]),
          String(pair.compare[i]),
          String(pair.mainCompare[i]),
          String(pair.complementCompare[i]),
        );
      }
    }
    rows.push(row.join(','));
  }
  return rows.join('\r\n') + '\r\n';
}

/** Letters, digits and `_` only (spaces and anything else become `_`). */
function slug(name: string): string {
  return name.replace(/[^A-Za-z0-9]+/g, '_');
}
