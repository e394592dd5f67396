import type { Waveform } from '../waveform/Waveform.js';

/**
 * The two quarter-wave symmetric pattern families selective harmonic elimination works on.
 *
 * - `'bipolar'`: a two-level waveform (±vdc) that changes sign at each first-quarter angle. The
 *   level held on (α_N, π/2), next to the positive peak of sin θ, is +vdc, so the waveform
 *   starts at (−1)^N·vdc just after θ = 0 (for an even count N it starts at +vdc).
 * - `'staircase'`: a multilevel waveform from N equal DC sources of vdc each (for example N
 *   cascaded H-bridge cells): 0 on (0, α_1), then one vdc step up at each angle, N·vdc on
 *   (α_N, π/2).
 *
 * Both are completed over the period by quarter-wave symmetry v(π − θ) = v(θ) and half-wave
 * symmetry v(θ + π) = −v(θ), so only odd harmonics in phase with sin(nθ) remain (H. S. Patel
 * and R. G. Hoft, IEEE Trans. Ind. Appl., 1973).
 */
export type SheKind = 'bipolar' | 'staircase';

/** The kinds {@link SheKind} allows, for validation and for the API's schema. */
export const SHE_KINDS: readonly SheKind[] = ['bipolar', 'staircase'];

/** What every quarter-wave pattern search returns; plain data. */
export interface QuarterWavePattern {
  /** True when the search met its goal (see the function that returns it). */
  converged: boolean;
  /** What happened, in plain words (why no solution, when there is none). */
  message: string;
  kind: SheKind;
  vdc: number;
  /** First-quarter angles in radians, ascending in (0, π/2); the closest attempt if not converged. */
  angles: number[];
  /** The full-period waveform the angles define (quarter- and half-wave symmetric). */
  waveform: Waveform;
  /** The fundamental of `waveform`, peak volts in phase with sin θ, from the exact spectrum. */
  fundamental: number;
  /** Iterations over all starts tried. */
  iterations: number;
  /** Number of starts tried. */
  starts: number;
}

/** The amplitude (peak volts, ≥ 0) that remains of one harmonic order. */
export interface OrderAmplitude {
  order: number;
  amplitude: number;
}

/** A grid of fundamentals for a sweep: `points` values evenly spaced from `from` to `to` volts. */
export interface FundamentalRange {
  from: number;
  to: number;
  points: number;
}

/** The distortion measure an optimal pulse pattern minimises when no weights are given. */
export type PulseObjective = 'wthd' | 'thd';

/** One harmonic order and its weight w in an objective √(Σ w·V_n²)/V₁. */
export interface OrderWeight {
  order: number;
  weight: number;
}
