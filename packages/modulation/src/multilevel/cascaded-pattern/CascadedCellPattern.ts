import type { Waveform } from '../../waveform/Waveform.js';

/**
 * The quarter-wave symmetric pattern one H-bridge cell of a cascaded string runs, from its
 * first-quarter angles α₁ < … < α_N in (0, π/2):
 * - `'bipolar'`: ±vdc, changing sign at each angle, +vdc held on (α_N, π/2) (the convention of
 *   `SheKind` 'bipolar'); b_n = s·(4vdc/(nπ))·[1 + 2Σ(−1)^k cos nα_k], s = (−1)^N (H. S. Patel
 *   and R. G. Hoft, IEEE Trans. Ind. Appl., 1973).
 * - `'unipolar'`: +vdc/0/−vdc, 0 on (0, α₁), then +vdc and 0 in turn at each angle (+vdc on
 *   (α_N, π/2) for odd N, 0 for even N); b_n = (4vdc/(nπ))·Σ(−1)^(k+1) cos nα_k (from
 *   b_n = (4/π)∫₀^{π/2} v sin nθ dθ, pen and paper; Patel and Hoft, 1973, for the method).
 *
 * Both are completed over the period by v(π − θ) = v(θ) and v(θ + π) = −v(θ): only odd
 * harmonics in phase with sin θ remain.
 */
export type CascadedCellKind = 'bipolar' | 'unipolar';

/** The kinds {@link CascadedCellKind} allows, in the order the API and the dashboard list them. */
export const CASCADED_CELL_KINDS: readonly CascadedCellKind[] = ['bipolar', 'unipolar'];

/** One cell's pattern. */
export interface CascadedCellPattern {
  kind: CascadedCellKind;
  /** The cell's DC source, volts, > 0. */
  vdc: number;
  /** First-quarter switching angles, radians, strictly ascending in (0, π/2). */
  angles: number[];
}

/** The waveforms of a cascaded string of cells, one fundamental period, exact. */
export interface CascadedPatternWaveforms {
  /** The string's output: the sum of the cells' outputs, volts. */
  output: Waveform;
  /** Each cell's output voltage (`cell 1`, `cell 2`, … in the order given), volts. */
  cells: { name: string; waveform: Waveform }[];
}
