import { assertOptimalPulseSweepOptions } from './assertOptimalPulseSweepOptions.js';
import { bestOptimum, describeOptimum } from './pulseSearch.js';
import { resolvePulseBase, type PulseSolverSettings } from './pulseOptions.js';
import { seededStarts } from './seededStarts.js';
import { fundamentalGrid } from './validateShe.js';
import type { FundamentalRange, SheKind } from './SheKind.js';

/** Options of {@link optimalPulseSweep}. */
export interface OptimalPulseSweepOptions extends PulseSolverSettings {
  kind: SheKind;
  /** DC source voltage, volts (> 0). */
  vdc: number;
  /** Number of first-quarter angles N when no `angles` are given. */
  count?: number;
  /** Optional first guess at the first fundamental; fixes N. */
  angles?: number[];
  /** The fundamentals (peak volts) to optimise at, evenly spaced. */
  fundamentals: FundamentalRange;
  /**
   * Largest change of any angle (radians) between neighbouring points still counted as the
   * same optimum followed; a larger change starts a fresh multi-start search there.
   * @default 0.1
   */
  maxAngleStep?: number;
  /** Called after each fundamental with the fraction done, 0..1. */
  onProgress?: (fraction: number) => void;
  /**
   * The optimum at the grid point before `fundamentals.from` (radians), from an earlier run over
   * the range before this one: the first point is followed from it, so a sweep run in parts
   * follows the same family as one run over the whole range.
   */
  previous?: number[];
}

/** One point of an optimal-pattern sweep. `angles` is empty where `converged` is false. */
export interface OptimalPulseSweepPoint {
  /** Peak volts. */
  fundamental: number;
  angles: number[];
  converged: boolean;
  /** √(Σ w_n·V_n²)/V₁ at this point (NaN where not converged). */
  objective: number;
  /**
   * True when this optimum was followed from the previous point's; false where a fresh search
   * was needed (the first point, or where the followed optimum vanished): the curve may jump.
   */
  continued: boolean;
}

/** The outcome of {@link optimalPulseSweep}. */
export interface OptimalPulseSweepResult {
  points: OptimalPulseSweepPoint[];
  /** Fraction of points with a strict local minimum, 0..1. */
  solvedFraction: number;
  /** A summary in plain words (where no optimum was found, where the curve jumps). */
  message: string;
  iterations: number;
}

/**
 * Optimal pulse patterns across a range of fundamentals with continuation: the best of a
 * multi-start search at the first point (see {@link optimalPulsePattern}), then each point
 * started from the previous optimum, so the angles trace one smooth family of local minima;
 * where that family ends (the optimum merges angles or vanishes) a fresh multi-start search
 * takes over and the point is marked `continued: false`. Harmonic model of Patel and Hoft
 * (IEEE Trans. Ind. Appl., 1973); WTHD of Holmes and Lipo (2003, ch. 3).
 *
 * @throws ParameterRangeError / ParameterTypeError for invalid input, as
 *   {@link optimalPulsePattern}, and for `fundamentals` outside the achievable range
 */
export function optimalPulseSweep(options: OptimalPulseSweepOptions): OptimalPulseSweepResult {
  assertOptimalPulseSweepOptions(options);
  const base = resolvePulseBase(options);
  const { fundamentals, maxAngleStep = 0.1, onProgress } = options;
  const grid = fundamentalGrid(fundamentals);
  const points: OptimalPulseSweepPoint[] = [];
  let previous: number[] | null = options.previous ?? null;
  let iterations = 0;
  grid.forEach((fundamental, i) => {
    let point: OptimalPulseSweepPoint | null = null;
    if (previous !== null) {
      const followed = bestOptimum(base, fundamental, [previous]);
      iterations += followed.iterations;
      const angles = followed.best.angles;
      const change = Math.max(
        ...angles.map((a, k) => Math.abs(a - ((previous as number[])[k] as number))),
      );
      if (followed.best.converged && change <= maxAngleStep) {
        const described = describeOptimum(base, followed.best, 0, 1, 1);
        point = {
          fundamental,
          angles: [...angles],
          converged: true,
          objective: described.objective,
          continued: true,
        };
      }
    }
    if (point === null) {
      const given = i === 0 && options.angles !== undefined ? [options.angles] : [];
      const search = bestOptimum(base, fundamental, [
        ...given,
        ...seededStarts(base.count, base.starts, base.seed + i),
      ]);
      iterations += search.iterations;
      const described = describeOptimum(base, search.best, 0, 1, 1);
      point = search.best.converged
        ? {
            fundamental,
            angles: [...search.best.angles],
            converged: true,
            objective: described.objective,
            continued: false,
          }
        : { fundamental, angles: [], converged: false, objective: NaN, continued: false };
    }
    points.push(point);
    previous = point.converged ? point.angles : null;
    onProgress?.((i + 1) / grid.length);
  });
  const solved = points.filter((p) => p.converged).length;
  const unsolved = points.filter((p) => !p.converged).map((p) => p.fundamental.toPrecision(5));
  const jumps = points
    .filter((p, i) => i > 0 && p.converged && !p.continued)
    .map((p) => p.fundamental.toPrecision(5));
  let message = `Optimum found at ${solved} of ${points.length} fundamentals.`;
  if (unsolved.length > 0) message += ` None found at ${unsolved.join(', ')} V.`;
  if (jumps.length > 0)
    message += ` The followed optimum was lost and searched afresh at ${jumps.join(', ')} V (the angles may jump there).`;
  return { points, solvedFraction: solved / points.length, message, iterations };
}
