import { resolvePulseBase, type PulseSolverSettings } from './pulseOptions.js';
import { bestOptimum, describeOptimum } from './pulseSearch.js';
import { seededStarts } from './seededStarts.js';
import { assertFundamental } from './validateShe.js';
import type { OptimalPulseResult } from './OptimalPulseResult.js';
import type { SheKind } from './SheKind.js';

export type { OptimalPulseResult } from './OptimalPulseResult.js';

/** Options of {@link optimalPulsePattern}. */
export interface OptimalPulseOptions extends PulseSolverSettings {
  /** Pattern family; conventions in {@link SheKind}. */
  kind: SheKind;
  /** DC source voltage, volts (> 0). */
  vdc: number;
  /** Number of first-quarter angles N (1..64), when no `angles` are given. */
  count?: number;
  /** Optional first guess (radians, ascending in (0, π/2)); fixes N. */
  angles?: number[];
  /** Wanted fundamental, peak volts in phase with sin θ, inside the achievable range. */
  fundamental: number;
}

/**
 * Optimal pulse pattern: first-quarter angles of a quarter-wave symmetric pattern
 * ({@link SheKind}) that minimise a weighted harmonic distortion √(Σ w_n·V_n²)/V₁ (WTHD by
 * default, Holmes and Lipo, *Pulse Width Modulation for Power Converters*, 2003, ch. 3)
 * subject to V₁ = `fundamental`. The harmonic model is that of Patel and Hoft (IEEE Trans.
 * Ind. Appl., 1973); the optimiser is a feasible-path Newton method on the KKT conditions with
 * the exact Hessian (see the method notes in docs/methods.md), run from the given angles
 * and `starts` seeded guesses, keeping the best strict local minimum. The optimum found is
 * local: more starts may find a better one.
 *
 * @throws ParameterRangeError / ParameterTypeError for invalid input: unknown kind or
 *   objective, vdc ≤ 0, bad angles or count, weights on even orders, a fundamental outside
 *   (0, 4vdc/π) (bipolar) or (0, N·4vdc/π) (staircase)
 */
export function optimalPulsePattern(options: OptimalPulseOptions): OptimalPulseResult {
  const base = resolvePulseBase(options);
  assertFundamental('fundamental', options.fundamental, base.kind, base.count, base.vdc);
  const given = options.angles === undefined ? [] : [options.angles];
  const starts = [...given, ...seededStarts(base.count, base.starts, base.seed)];
  const search = bestOptimum(base, options.fundamental, starts);
  return describeOptimum(base, search.best, search.iterations, starts.length, search.found);
}
