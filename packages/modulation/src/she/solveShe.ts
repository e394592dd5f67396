import { harmonics } from '../spectrum/harmonics.js';
import { createSheSystem } from './sheSystem.js';
import { searchSolutions } from './sheSearch.js';
import { seededStarts } from './seededStarts.js';
import { buildSheWaveform } from './buildSheWaveform.js';
import { assertSquare, resolveSheBase, type SheSolverSettings } from './sheOptions.js';
import { assertCellVoltages, assertFundamental } from './validateShe.js';
import type { OrderAmplitude, QuarterWavePattern, SheKind } from './SheKind.js';

/** Options of {@link solveShe}. */
export interface SolveSheOptions extends SheSolverSettings {
  /** Pattern family; conventions in {@link SheKind}. */
  kind: SheKind;
  /** DC source voltage, volts (> 0): the bipolar level or each staircase cell's step. */
  vdc: number;
  /**
   * Staircase only: each cell's DC source voltage, volts (> 0), one per first-quarter angle, cell
   * k switching at angle k (cascaded cells on unequal sources, for example a PV string per cell);
   * `vdc` then only sets the solver's per-unit base.
   * @default every cell at vdc
   */
  cellVoltages?: number[];
  /**
   * Initial guess: first-quarter angles (radians), strictly ascending in (0, π/2). Fixes the
   * number of angles N. Optional when `count` is given (then only seeded starts are used).
   */
  angles?: number[];
  /** Number of first-quarter angles N (1..64) when no `angles` are given. */
  count?: number;
  /** Odd orders ≥ 3 to null: N − 1 of them with a `fundamental`, N without. */
  eliminate: number[];
  /**
   * Wanted fundamental, peak volts in phase with sin θ, in (0, 4vdc/π) for bipolar,
   * (0, N·4vdc/π) for staircase and (0, 4ΣV_k/π) for a staircase of `cellVoltages`. Omit it to
   * spend every angle on elimination.
   */
  fundamental?: number;
}

/** The outcome of {@link solveShe}; plain data. */
export interface SheResult extends QuarterWavePattern {
  /**
   * True when every eliminated order and the fundamental meet the tolerance. The fundamental
   * is negative if the pattern came out in antiphase.
   */
  converged: boolean;
  /** Remaining amplitude (peak volts) of each eliminated order, from the exact spectrum. */
  residual: OrderAmplitude[];
  /** The cells' DC source voltages, volts, when they were given (staircase of unequal cells). */
  cellVoltages?: number[];
}

/**
 * Selective harmonic elimination for a quarter-wave symmetric pattern (H. S. Patel and R. G.
 * Hoft, "Generalized techniques of harmonic elimination and voltage control in thyristor
 * inverters", IEEE Trans. Ind. Appl., 1973): finds first-quarter angles α₁ < … < α_N in
 * (0, π/2) with b_n = 0 for each order in `eliminate` and b₁ = `fundamental`, where
 * b_n = s·(4vdc/(nπ))·[1 + 2Σ(−1)^k cos nα_k] (bipolar, s = (−1)^N) or
 * b_n = (4vdc/(nπ))·Σ cos nα_k (staircase), or b_n = (4/(nπ))·Σ V_k·cos nα_k for a staircase of
 * unequal DC sources V_k = `cellVoltages[k]` (L. M. Tolbert, J. N. Chiasson, Z. Du,
 * K. J. McKenzie, "Elimination of harmonics in a multilevel converter with nonequal DC
 * sources", IEEE Trans. Ind. Appl., 2005, title and year from memory); conventions in
 * {@link SheKind}.
 *
 * Method: damped Newton–Raphson with the analytic Jacobian (solved with ml-matrix), steps kept
 * inside the ordered region, from the given angles and then from `starts` seeded guesses until
 * one converges. A missing solution is not an error: `converged` is false and `message` says
 * why. The returned residual and fundamental are measured on the built waveform by the exact
 * {@link harmonics}, not by the model the solver used.
 *
 * @throws ParameterRangeError / ParameterTypeError for invalid input: unknown kind, vdc ≤ 0,
 *   angles not ascending in (0, π/2), eliminate holding even orders, order 1 or repeats, the
 *   wrong number of orders for N, a fundamental outside the achievable range, or `cellVoltages`
 *   with a bipolar kind, of a length other than N or holding a value ≤ 0
 */
export function solveShe(options: SolveSheOptions): SheResult {
  const base = resolveSheBase(options);
  const { kind, vdc, count, eliminate } = base;
  const { fundamental, cellVoltages } = options;
  if (cellVoltages !== undefined) assertCellVoltages('cellVoltages', cellVoltages, kind, count);
  if (fundamental !== undefined)
    assertFundamental('fundamental', fundamental, kind, count, vdc, cellVoltages);
  assertSquare(eliminate, count, fundamental !== undefined);
  const scale = (4 * vdc) / Math.PI;
  const system = createSheSystem(
    kind,
    count,
    eliminate,
    fundamental === undefined ? undefined : fundamental / scale,
    cellVoltages?.map((v) => v / vdc),
  );
  const given = options.angles === undefined ? [] : [options.angles];
  const starts = [...given, ...seededStarts(count, base.starts, base.seed)];
  const search = searchSolutions(system, starts, base.search, false);
  const angles = search.solutions[0] ?? search.best.angles;
  const waveform = buildSheWaveform(kind, vdc, angles, cellVoltages);
  const spectrum = harmonics(waveform, Math.max(1, ...eliminate));
  const first = spectrum[1];
  const achieved = first === undefined ? 0 : first.amplitude * Math.cos(first.phase);
  const converged = search.solutions.length > 0;
  return {
    converged,
    message: converged
      ? `Converged after ${search.tried} start(s), ${search.iterations} Newton iteration(s) in all.`
      : noSolutionMessage(search.tried, search.reason, count, eliminate, fundamental),
    kind,
    vdc,
    angles: [...angles],
    waveform,
    fundamental: achieved,
    residual: eliminate.map((order) => ({ order, amplitude: spectrum[order]?.amplitude ?? NaN })),
    iterations: search.iterations,
    starts: search.tried,
    ...(cellVoltages === undefined ? {} : { cellVoltages: [...cellVoltages] }),
  };
}

function noSolutionMessage(
  tried: number,
  reason: string,
  count: number,
  eliminate: readonly number[],
  fundamental: number | undefined,
): string {
  const target =
    fundamental === undefined ? '' : ` at a fundamental of ${fundamental.toPrecision(6)} V`;
  return (
    `No solution found from ${tried} start(s): ${reason}. With ${count} angle(s) eliminating ` +
    `order(s) ${eliminate.join(', ') || 'none'}${target}, there may be no solution at all; ` +
    'try another fundamental, more angles, or more starts.'
  );
}
