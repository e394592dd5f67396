import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import {
  ANGLE_TABLE_ERROR_METRICS,
  MAX_ANGLE_TABLE_ROWS,
  type AngleTable,
  type AngleTableErrorMetric,
  type AngleTableMidpointErrors,
  type AngleTableOptions,
} from './angleTableTypes.js';
import { angleTable } from './angleTable.js';
import { angleTableMidpointErrors } from './angleTableMidpointErrors.js';
import { assertRows } from './resolveAngleTable.js';

/** Options of {@link angleTableRowsForTarget}. */
export interface AngleTableTargetOptions extends Omit<AngleTableOptions, 'rows'> {
  /**
   * The largest midpoint error allowed on every interpolable interval: `metric`
   * `'eliminated-residual'` (|V_n|/V₁, SHE patterns only), `'fundamental-error'`
   * (|ΔV₁|/V₁) or `'wthd-change'` (|ΔWTHD|, ratio); `value` > 0.
   */
  target: { metric: AngleTableErrorMetric; value: number };
  /** The most rows tried, 2..1024. @default 256 */
  maxRows?: number;
}

/** The outcome of {@link angleTableRowsForTarget}. */
export interface AngleTableForTarget {
  /** The smallest number of rows found that meets the target. */
  rows: number;
  /** Its midpoint error in the target's metric. */
  error: number;
  table: AngleTable;
  midpointErrors: AngleTableMidpointErrors;
  /** Every row count tried with its error (null: no interpolable interval), in the order tried. */
  tried: { rows: number; error: number | null }[];
}

/**
 * The fewest rows N for which every interpolable interval of an {@link angleTable} meets an
 * error target, by its {@link angleTableMidpointErrors}. N is doubled from 2 until the target is
 * met (or `maxRows` is reached), then bisected between the last N that failed and the first that
 * met it. Bisection assumes the error falls as N grows, which holds on a smooth branch (the
 * error of linear interpolation falls as 1/N², a fact of calculus); the returned table is one
 * actually measured to meet the target.
 *
 * @throws ParameterRangeError naming the field: `target.metric` not one of the metrics (or
 *   `'eliminated-residual'` for an optimal pattern, which eliminates nothing), `target.value`
 *   ≤ 0, `maxRows` outside 2..1024, and `target.value` when no N up to `maxRows` reaches it (the
 *   message gives the error reached); and the errors of {@link angleTable}
 */
export function angleTableRowsForTarget(options: AngleTableTargetOptions): AngleTableForTarget {
  const { target, maxRows = 256, ...tableOptions } = options;
  if (typeof target !== 'object' || target === null) {
    throw new ParameterTypeError('target', 'an object { metric, value }', target);
  }
  assertOneOf('target.metric', target.metric, ANGLE_TABLE_ERROR_METRICS);
  assertNumberInRange('target.value', target.value, { min: 0, minExclusive: true, max: 1 });
  assertRows('maxRows', maxRows, MAX_ANGLE_TABLE_ROWS);
  if (
    target.metric === 'eliminated-residual' &&
    tableOptions.pattern?.method === 'optimal-pattern'
  ) {
    throw new ParameterRangeError(
      'target.metric',
      "'fundamental-error' or 'wthd-change' for an optimal pattern (it eliminates no order)",
      target.metric,
    );
  }
  const tried: AngleTableForTarget['tried'] = [];
  const measure = (rows: number) => {
    const table = angleTable({ ...tableOptions, rows });
    const midpointErrors = angleTableMidpointErrors(table);
    const error = metricOf(midpointErrors, target.metric);
    tried.push({ rows, error });
    return { rows, table, midpointErrors, error };
  };
  const meets = (e: number | null): e is number => e !== null && e <= target.value;
  let failed = 1;
  let met: ReturnType<typeof measure> | null = null;
  let last: ReturnType<typeof measure> | null = null;
  for (let rows = 2; met === null; rows = Math.min(2 * rows, maxRows)) {
    last = measure(rows);
    if (meets(last.error)) met = last;
    else failed = rows;
    if (rows === maxRows) break;
  }
  if (met === null) {
    const reached =
      last?.error === null || last === null
        ? 'no interpolable interval'
        : `an error of ${last.error.toPrecision(3)}`;
    throw new ParameterRangeError(
      'target.value',
      `reachable with at most maxRows = ${maxRows} rows (${maxRows} rows give ${reached}); raise the target or maxRows, or narrow the range`,
      target.value,
    );
  }
  while (met.rows - failed > 1) {
    const middle = Math.floor((met.rows + failed) / 2);
    const attempt = measure(middle);
    if (meets(attempt.error)) met = attempt;
    else failed = middle;
  }
  return {
    rows: met.rows,
    error: met.error as number,
    table: met.table,
    midpointErrors: met.midpointErrors,
    tried,
  };
}

function metricOf(errors: AngleTableMidpointErrors, metric: AngleTableErrorMetric): number | null {
  if (metric === 'eliminated-residual') return errors.worstResidual;
  if (metric === 'fundamental-error') return errors.worstFundamentalError;
  return errors.worstWthdChange;
}
