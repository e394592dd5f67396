import type { QuarterWavePattern } from './SheKind.js';

/** The outcome of `optimalPulsePattern` (in its own file so the search helpers can name it without an import cycle); plain data. */
export interface OptimalPulseResult extends QuarterWavePattern {
  /** True when a strict local minimum was found (stationary, positive curvature on the constraint). */
  converged: boolean;
  /** √(Σ w_n·V_n²)/V₁ from the exact spectrum (for 'wthd', the WTHD over orders ≤ maxOrder). */
  objective: number;
}
