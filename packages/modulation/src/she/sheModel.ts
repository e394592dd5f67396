/**
 * The harmonic model of quarter-wave symmetric patterns (internal to she/).
 *
 * For odd n the sine coefficient of the full-period waveform is
 *   b_n = (4·vdc/π)·g_n,   g_n = (1/n)·[σ₀ + Σ_k σ_k·cos(n·α_k)],
 * with, in the conventions of {@link SheKind}:
 * - bipolar, N angles, s = (−1)^N:  σ₀ = s, σ_k = 2·s·(−1)^k, i.e.
 *   b_n = s·(4vdc/(nπ))·[1 + 2·Σ(−1)^k cos(nα_k)]  (Patel and Hoft, 1973); derivation:
 *   b_n = (4/π)∫₀^{π/2} v sin(nθ) dθ with v = s(−1)^k·vdc on (α_k, α_{k+1}), α₀ = 0,
 *   α_{N+1} = π/2, and cos(nπ/2) = 0 for odd n;
 * - staircase: σ₀ = 0, σ_k = 1, i.e. b_n = (4vdc/(nπ))·Σ cos(nα_k); with unequal cell
 *   voltages V_k (cell k switching at α_k), σ_k = V_k/vdc, i.e. b_n = (4/(nπ))·Σ V_k·cos(nα_k)
 *   (L. M. Tolbert, J. N. Chiasson, Z. Du, K. J. McKenzie, "Elimination of harmonics in a
 *   multilevel converter with nonequal DC sources", IEEE Trans. Ind. Appl., 2005, from memory).
 * Even orders and DC vanish by half-wave symmetry.
 */
import type { SheKind } from './SheKind.js';

/** The constants σ₀ and σ_k of the model for `count` angles. */
export interface PatternWeights {
  offset: number;
  signs: number[];
}

/**
 * σ₀ and σ_k for a pattern of `kind` with `count` first-quarter angles; `cellScales` (staircase
 * only) are V_k/vdc, one per angle, 1 each when not given (equal cells).
 */
export function patternWeights(
  kind: SheKind,
  count: number,
  cellScales?: readonly number[],
): PatternWeights {
  if (kind === 'staircase') {
    return { offset: 0, signs: cellScales ? [...cellScales] : new Array<number>(count).fill(1) };
  }
  const s = count % 2 === 0 ? 1 : -1;
  const signs: number[] = [];
  for (let k = 1; k <= count; k++) signs.push(2 * s * (k % 2 === 0 ? 1 : -1));
  return { offset: s, signs };
}

/** g_n = b_n/(4vdc/π): the normalised sine coefficient of odd order n. */
export function normalisedCoefficient(
  weights: PatternWeights,
  angles: readonly number[],
  order: number,
): number {
  let sum = weights.offset;
  for (let k = 0; k < angles.length; k++) {
    sum += (weights.signs[k] as number) * Math.cos(order * (angles[k] as number));
  }
  return sum / order;
}

/** ∂g_n/∂α_k = −σ_k·sin(n·α_k), written into `out` (length = angles.length). */
export function coefficientGradient(
  weights: PatternWeights,
  angles: readonly number[],
  order: number,
  out: number[],
): void {
  for (let k = 0; k < angles.length; k++) {
    out[k] = -(weights.signs[k] as number) * Math.sin(order * (angles[k] as number));
  }
}

/** ∂²g_n/∂α_k² = −n·σ_k·cos(n·α_k) (the Hessian of g_n is diagonal). */
export function coefficientCurvature(
  weights: PatternWeights,
  angles: readonly number[],
  order: number,
  out: number[],
): void {
  for (let k = 0; k < angles.length; k++) {
    out[k] = -order * (weights.signs[k] as number) * Math.cos(order * (angles[k] as number));
  }
}

/**
 * The largest fundamental (peak volts) a pattern of `kind` with `count` angles approaches: 4vdc/π
 * (bipolar), N·4vdc/π (staircase of equal cells) or 4ΣV_k/π (staircase of `cellVoltages`).
 */
export function fundamentalLimit(
  kind: SheKind,
  count: number,
  vdc: number,
  cellVoltages?: readonly number[],
): number {
  if (kind === 'staircase' && cellVoltages) {
    return (4 * cellVoltages.reduce((sum, v) => sum + v, 0)) / Math.PI;
  }
  return ((kind === 'staircase' ? count : 1) * 4 * vdc) / Math.PI;
}
