import type { AngleTable, AngleTableMidpointErrors } from './angleTableTypes.js';
import { angleTableFixedPoint, type AngleTableFixedPointOptions } from './angleTableFixedPoint.js';

/** Options of {@link angleTableToCsv}; each part is added only when given. */
export interface AngleTableCsvOptions {
  /** Adds, per row, the error of the interval to the next row. */
  midpointErrors?: AngleTableMidpointErrors;
  /** Adds the Q0.n fractions and timer ticks of each angle. */
  fixedPoint?: AngleTableFixedPointOptions;
}

/**
 * An {@link angleTable} as CSV (RFC 4180: comma separated, CRLF line ends; every cell is a
 * number or a fixed word, so none needs quoting): a header row, then one row per table row with
 * `row`, `ma`, `solved` and `continued` (1/0), `angle_k_rad`, `fundamental_V`,
 * `residual_<order>_V` per eliminated order, `worst_residual` and `wthd` (ratios); with
 * `fixedPoint`, `fraction_k` (Q0.n integers) and `ticks_k`; with `midpointErrors`, the interval
 * from this row to the next: `next_interpolable` (1/0), `next_worst_residual`,
 * `next_fundamental_error`, `next_wthd_change`. Empty cells where a value does not exist
 * (a row without a solution, the last row's interval).
 */
export function angleTableToCsv(table: AngleTable, options: AngleTableCsvOptions = {}): string {
  const { midpointErrors, fixedPoint } = options;
  const { count, pattern } = table.parameters;
  const fixed = fixedPoint === undefined ? null : angleTableFixedPoint(table, fixedPoint);
  const indices = Array.from({ length: count }, (_, k) => k + 1);
  const orders = pattern.method === 'selective-harmonic-elimination' ? pattern.eliminate : [];
  const header = [
    'row',
    'ma',
    'solved',
    'continued',
    ...indices.map((k) => `angle_${k}_rad`),
    'fundamental_V',
    ...orders.map((n) => `residual_${n}_V`),
    'worst_residual',
    'wthd',
    ...(fixed === null
      ? []
      : [...indices.map((k) => `fraction_${k}`), ...indices.map((k) => `ticks_${k}`)]),
    ...(midpointErrors === undefined
      ? []
      : ['next_interpolable', 'next_worst_residual', 'next_fundamental_error', 'next_wthd_change']),
  ];
  const lines = [header];
  table.rows.forEach((row, i) => {
    const cells = [
      String(i),
      String(row.ma),
      row.solved ? '1' : '0',
      row.continued ? '1' : '0',
      ...indices.map((k) => cell(row.angles[k - 1])),
      cell(row.fundamental),
      ...orders.map((n) => cell(row.residuals.find((r) => r.order === n)?.amplitude)),
      cell(row.worstResidual),
      cell(row.wthd),
    ];
    if (fixed !== null) {
      cells.push(...indices.map((k) => cell(fixed.fractions[i]?.[k - 1])));
      cells.push(...indices.map((k) => cell(fixed.ticks[i]?.[k - 1])));
    }
    if (midpointErrors !== undefined) {
      const interval = midpointErrors.intervals[i];
      cells.push(
        interval === undefined ? '' : interval.interpolable ? '1' : '0',
        cell(interval?.worstResidual),
        cell(interval?.fundamentalError),
        cell(interval?.wthdChange),
      );
    }
    lines.push(cells);
  });
  return lines.map((line) => line.join(',')).join('\r\n') + '\r\n';
}

function cell(value: number | null | undefined): string {
  return value === null || value === undefined ? '' : String(value);
}
