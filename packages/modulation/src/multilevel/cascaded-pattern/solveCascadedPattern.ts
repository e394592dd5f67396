import { harmonics } from '../../spectrum/harmonics.js';
import { searchSolutions } from '../../she/sheSearch.js';
import { seededStarts } from '../../she/seededStarts.js';
import { systemOfWeights } from '../../she/sheSystem.js';
import { resolveSolverSettings, type SheSolverSettings } from '../../she/sheOptions.js';
import {
  assertFirstQuarterAngles,
  assertOddOrders,
  MAX_SHE_ANGLES,
} from '../../she/validateShe.js';
import type { OrderAmplitude } from '../../she/SheKind.js';
import { assertNumberInRange } from '../../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import { MAX_CASCADED_CELLS } from './assertCascadedCells.js';
import { buildCascadedPattern } from './buildCascadedPattern.js';
import type { CascadedCellPattern, CascadedPatternWaveforms } from './CascadedCellPattern.js';

/** Options of {@link solveCascadedPattern}. */
export interface SolveCascadedPatternOptions extends SheSolverSettings {
  /** Identical H-bridge cells in the string, an integer 1..16. */
  cells: number;
  /** Each cell's DC source, volts, > 0. */
  vdc: number;
  /** First-quarter angles of each cell's unipolar pattern, an integer ≥ 1; cells·count ≤ 64. */
  count: number;
  /** cells·count − 1 distinct odd orders ≥ 3 to null in the string's output. */
  eliminate: number[];
  /** Wanted fundamental of the string's output, peak volts in phase with sin θ, in (0, cells·4vdc/π). */
  fundamental: number;
  /** Initial guess: `cells` arrays of `count` angles each (radians, ascending in (0, π/2)). */
  angles?: number[][];
}

/** The outcome of {@link solveCascadedPattern}; plain data. */
export interface CascadedPatternResult extends CascadedPatternWaveforms {
  /** True when every eliminated order and the fundamental meet the tolerance. */
  converged: boolean;
  /** What happened, in plain words (why no solution, when there is none). */
  message: string;
  /** Each cell's unipolar pattern (the closest attempt if not converged), cell by cell. */
  patterns: CascadedCellPattern[];
  /** The fundamental of `output`, peak volts in phase with sin θ, from the exact spectrum. */
  fundamental: number;
  /** Remaining amplitude (peak volts) of each eliminated order in `output`, exact spectrum. */
  residual: OrderAmplitude[];
  /** Newton iterations over all starts tried. */
  iterations: number;
  /** Number of starts tried. */
  starts: number;
}

/**
 * Selective harmonic elimination for a cascaded H-bridge string of `cells` identical cells, each
 * running its own unipolar pattern of `count` first-quarter angles (conventions in
 * `CascadedCellKind`), solved jointly: the unknowns are all cells·count angles, the string's
 * b_n = (4vdc/(nπ))·Σ_cells Σ_k (−1)^(k+1) cos nα_{c,k} is set to the wanted fundamental at n = 1
 * and to zero at each order in `eliminate` (method of H. S. Patel and R. G. Hoft, IEEE Trans.
 * Ind. Appl., 1973; the string's output is the sum of its cells', Holmes and Lipo, 2003, ch. 11).
 *
 * Method: the damped Newton–Raphson of `solveShe` with each cell's angles kept ordered in
 * (0, π/2) on their own; starts interleave the cells (seeded ascending sets dealt to the cells in
 * turn), since cells with equal angles make the Jacobian singular. A missing solution is not an
 * error: `converged` is false and `message` says why. The residual and fundamental are measured
 * on the built string waveform by the exact {@link harmonics}.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field and its allowed range
 */
export function solveCascadedPattern(options: SolveCascadedPatternOptions): CascadedPatternResult {
  const { cells, vdc, count, eliminate, fundamental, angles } = options;
  assertNumberInRange('cells', cells, { min: 1, max: MAX_CASCADED_CELLS, integer: true });
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertNumberInRange('count', count, { min: 1, integer: true });
  const perCell = Math.floor(MAX_SHE_ANGLES / cells);
  if (count > perCell) {
    throw new ParameterRangeError(
      'count',
      `an integer in [1, ${perCell}] (cells·count ≤ ${MAX_SHE_ANGLES} angles in all)`,
      count,
    );
  }
  const total = cells * count;
  assertOddOrders('eliminate', eliminate);
  if (eliminate.length !== total - 1) {
    throw new ParameterRangeError(
      'eliminate.length',
      `cells·count − 1 = ${total - 1} (one equation per angle; the fundamental takes one)`,
      eliminate.length,
    );
  }
  const scale = (4 * vdc) / Math.PI;
  assertNumberInRange('fundamental', fundamental, {
    min: 0,
    minExclusive: true,
    max: cells * scale,
    maxExclusive: true,
  });
  const given = angles === undefined ? [] : [flattenGuess(angles, cells, count)];
  const settings = resolveSolverSettings(options);
  const signs: number[] = [];
  for (let c = 0; c < cells; c++) for (let k = 1; k <= count; k++) signs.push(k % 2 === 1 ? 1 : -1);
  const system = systemOfWeights({ offset: 0, signs }, count, eliminate, fundamental / scale);
  const starts = [
    ...given,
    ...seededStarts(total, settings.starts, settings.seed).map((s) => dealt(s, cells, count)),
  ];
  const search = searchSolutions(system, starts, settings.search, false);
  const solution = search.solutions[0] ?? search.best.angles;
  const patterns: CascadedCellPattern[] = Array.from({ length: cells }, (_, c) => ({
    kind: 'unipolar',
    vdc,
    angles: solution.slice(c * count, (c + 1) * count),
  }));
  const waveforms = buildCascadedPattern(patterns);
  const spectrum = harmonics(waveforms.output, Math.max(1, ...eliminate));
  const first = spectrum[1];
  const converged = search.solutions.length > 0;
  return {
    converged,
    message: converged
      ? `Converged after ${search.tried} start(s), ${search.iterations} Newton iteration(s) in all.`
      : `No solution found from ${search.tried} start(s): ${search.reason}. With ${cells} cell(s) ` +
        `of ${count} angle(s) eliminating order(s) ${eliminate.join(', ') || 'none'} at a ` +
        `fundamental of ${fundamental.toPrecision(6)} V, there may be no solution at all; try ` +
        'another fundamental, more angles, or more starts.',
    patterns,
    ...waveforms,
    fundamental: first === undefined ? 0 : first.amplitude * Math.cos(first.phase),
    residual: eliminate.map((order) => ({ order, amplitude: spectrum[order]?.amplitude ?? NaN })),
    iterations: search.iterations,
    starts: search.tried,
  };
}

/** The guess as one vector, cell after cell, after checking its shape. */
function flattenGuess(angles: unknown, cells: number, count: number): number[] {
  if (!Array.isArray(angles)) {
    throw new ParameterTypeError('angles', 'an array of angle arrays, one per cell', angles);
  }
  if (angles.length !== cells) {
    throw new ParameterRangeError(
      'angles.length',
      `cells = ${cells} (one array per cell)`,
      angles.length,
    );
  }
  return angles.flatMap((cell: unknown, c) => {
    assertFirstQuarterAngles(`angles[${c}]`, cell);
    if (cell.length !== count) {
      throw new ParameterRangeError(`angles[${c}].length`, `count = ${count}`, cell.length);
    }
    return cell;
  });
}

/** An ascending set dealt to the cells in turn (cell c takes entries c, c + cells, …), cell by cell. */
function dealt(ascending: readonly number[], cells: number, count: number): number[] {
  const out: number[] = [];
  for (let c = 0; c < cells; c++)
    for (let k = 0; k < count; k++) out.push(ascending[c + k * cells] as number);
  return out;
}
