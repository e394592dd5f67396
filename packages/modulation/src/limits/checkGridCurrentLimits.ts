import type { Harmonic } from '../spectrum/Harmonic.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { LimitViolation } from './checkVoltageHarmonicLimits.js';
import {
  GRID_CURRENT_LIMIT_CAUTION,
  IEEE_1547_2018_CURRENT,
  IEEE_1547_2018_CURRENT_LIMITS,
  IEEE_1547_2018_EVEN_LIMITS,
  IEEE_519_2022_CURRENT,
  IEEE_519_2022_CURRENT_LIMITS,
  type CurrentLimitRow,
} from './gridCurrentLimits.js';
import type { LimitStandard } from './voltageHarmonicLimits.js';
import { amplitudesByOrder } from './amplitudesByOrder.js';

/** The current-distortion standards {@link checkGridCurrentLimits} knows. */
export type GridCurrentStandard = 'ieee-519' | 'ieee-1547';

/** The standards {@link GridCurrentStandard} allows, for validation and forms. */
export const GRID_CURRENT_STANDARDS: readonly GridCurrentStandard[] = ['ieee-519', 'ieee-1547'];

/** Options of {@link checkGridCurrentLimits}. */
export interface GridCurrentLimitOptions {
  standard: GridCurrentStandard;
  /**
   * The reference current, peak amperes, > 0: the maximum demand load current I_L (519) or the
   * rated current (1547), as the amplitude of its fundamental.
   */
  referenceCurrent: number;
  /** I_SC/I_L at the point of common coupling, > 0; picks the 519 row (ignored for 1547). */
  shortCircuitRatio: number;
  /**
   * IEEE 519 only: the equipment generates power, so the first row applies whatever the
   * short-circuit ratio (a footnote of Table 2, from memory). @default true
   */
  generation?: boolean;
  /** Total distortion over the whole waveform, every order ≥ 2, over the reference current, ratio ≥ 0. */
  totalWholeWaveform: number;
}

/** The outcome of {@link checkGridCurrentLimits}; the shape of the voltage check's, for currents. */
export interface GridCurrentLimitCheck {
  standard: LimitStandard;
  /** The row applied, its range in words and whether the generation footnote chose it. */
  row: { label: string; byGenerationRule: boolean };
  shortCircuitRatio: number;
  /** Peak amperes. */
  referenceCurrent: number;
  /** Each order 2..50 over the reference current, with its limit. */
  table: { order: number; ratio: number; limit: number; pass: boolean }[];
  /** TDD (519) or TRD (1547) over orders 2..50, ratio. */
  total: number;
  totalLimit: number;
  /** The same over every order, ratio (as given). */
  totalWholeWaveform: number;
  /** √(whole² − table²): the orders above 50, ratio. */
  totalAboveTable: number;
  worstIndividual: { order: number; ratio: number };
  violations: LimitViolation[];
  pass: boolean;
  /** Set when the orders above 50 alone exceed the total limit. */
  note: string | null;
  caution: string;
}

/** The limit of one order in a row; even orders by the standard's rule. */
function limitOf(row: CurrentLimitRow, order: number, standard: GridCurrentStandard): number {
  const band = row.oddBands.find((b) => order >= b.minOrder && order <= b.maxOrder);
  // Order 2 sits below the first band: it takes the first band's limit as the even rule's base.
  const odd = band?.limit ?? (row.oddBands[0] as CurrentLimitRow['oddBands'][number]).limit;
  if (order % 2 === 1) return odd;
  if (standard === 'ieee-1547') return IEEE_1547_2018_EVEN_LIMITS[order] ?? odd;
  return odd / 4;
}

/**
 * Checks a grid current against the current-distortion limits of IEEE Std 519-2022 Table 2 (by
 * I_SC/I_L) or IEEE Std 1547-2018 Tables 26–27, both recalled from memory (the caution says so:
 * confirm with the standards and the utility). Each order 2..50 is compared with its band's
 * limit as a ratio of the reference current; the total (TDD or TRD) to order 50 and over the
 * whole waveform must be within the total limit for a pass, as for the voltage check.
 *
 * @param spectrum - the current's harmonics, peak amperes, orders 0..50 at least
 * @throws ParameterRangeError naming `standard`, `spectrum`, `referenceCurrent`,
 *   `shortCircuitRatio` or `totalWholeWaveform`
 */
export function checkGridCurrentLimits(
  spectrum: readonly Harmonic[],
  options: GridCurrentLimitOptions,
): GridCurrentLimitCheck {
  const { standard, referenceCurrent, shortCircuitRatio, generation = true } = options;
  const { totalWholeWaveform } = options;
  assertOneOf('standard', standard, GRID_CURRENT_STANDARDS);
  assertNumberInRange('referenceCurrent', referenceCurrent, { min: 0, minExclusive: true });
  assertNumberInRange('shortCircuitRatio', shortCircuitRatio, { min: 0, minExclusive: true });
  assertNumberInRange('totalWholeWaveform', totalWholeWaveform, { min: 0 });
  const is519 = standard === 'ieee-519';
  const source = is519 ? IEEE_519_2022_CURRENT : IEEE_1547_2018_CURRENT;
  const byGenerationRule = is519 && generation;
  const row = !is519
    ? IEEE_1547_2018_CURRENT_LIMITS
    : byGenerationRule
      ? (IEEE_519_2022_CURRENT_LIMITS[0] as CurrentLimitRow)
      : (IEEE_519_2022_CURRENT_LIMITS.find(
          (r) => shortCircuitRatio < (r.shortCircuitRatio?.max ?? Infinity),
        ) as CurrentLimitRow);
  const byOrder = amplitudesByOrder(spectrum, source.maxOrder);
  if (byOrder[source.maxOrder] === undefined)
    throw new ParameterRangeError(
      'spectrum',
      `a spectrum holding orders up to ${source.maxOrder}`,
      spectrum.length,
    );
  const table = [];
  let sumOfSquares = 0;
  for (let order = 2; order <= source.maxOrder; order++) {
    const ratio = (byOrder[order] ?? 0) / referenceCurrent;
    const limit = limitOf(row, order, standard);
    sumOfSquares += ratio * ratio;
    table.push({ order, ratio, limit, pass: ratio <= limit });
  }
  const total = Math.sqrt(sumOfSquares);
  const totalAboveTable = Math.sqrt(Math.max(0, totalWholeWaveform ** 2 - sumOfSquares));
  const worst = table.reduce((a, b) => (b.ratio > a.ratio ? b : a));
  const violations: LimitViolation[] = [];
  if (totalWholeWaveform > row.total)
    violations.push({ order: 'thd-whole-waveform', ratio: totalWholeWaveform, limit: row.total });
  if (total > row.total) violations.push({ order: 'thd', ratio: total, limit: row.total });
  for (const entry of table)
    if (!entry.pass)
      violations.push({ order: entry.order, ratio: entry.ratio, limit: entry.limit });
  const name = is519 ? 'TDD' : 'TRD';
  return {
    standard: source,
    row: { label: row.label, byGenerationRule },
    shortCircuitRatio,
    referenceCurrent,
    table,
    total,
    totalLimit: row.total,
    totalWholeWaveform,
    totalAboveTable,
    worstIndividual: { order: worst.order, ratio: worst.ratio },
    violations,
    pass: violations.length === 0,
    note:
      totalAboveTable > row.total
        ? `The current's orders above ${source.maxOrder} alone amount to ${(100 * totalAboveTable).toFixed(2)} % of the reference current, ` +
          `more than the ${(100 * row.total).toFixed(1)} % ${name} limit: the table's orders do not show it, the grid carries it.`
        : null,
    caution: GRID_CURRENT_LIMIT_CAUTION,
  };
}
