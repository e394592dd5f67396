/**
 * Keeping first-quarter angles strictly ordered inside (0, π/2) during iterations (internal):
 * the fraction-to-boundary rule of interior-point methods (J. Nocedal and S. J. Wright,
 * *Numerical Optimization*, 2nd ed., 2006, §16.6 and §19.2) applied to the gaps
 * α₁ − 0, α_{k+1} − α_k, π/2 − α_N.
 */
import { HALF_PI } from '../math.js';

/** The largest t ≤ 1 such that α + t·δ keeps every gap above (1 − fraction) of its size. */
export function maxOrderedStep(
  angles: readonly number[],
  step: readonly number[],
  fraction = 0.9,
): number {
  let t = 1;
  const count = angles.length;
  for (let k = 0; k <= count; k++) {
    const low = k === 0 ? 0 : (angles[k - 1] as number);
    const high = k === count ? HALF_PI : (angles[k] as number);
    const dLow = k === 0 ? 0 : (step[k - 1] as number);
    const dHigh = k === count ? 0 : (step[k] as number);
    const shrink = dLow - dHigh;
    if (shrink > 0) t = Math.min(t, (fraction * (high - low)) / shrink);
  }
  return t;
}

/** The smallest gap between neighbouring angles, or to 0 and π/2, in radians. */
export function smallestGap(angles: readonly number[]): number {
  let gap = Infinity;
  for (let k = 0; k <= angles.length; k++) {
    const low = k === 0 ? 0 : (angles[k - 1] as number);
    const high = k === angles.length ? HALF_PI : (angles[k] as number);
    gap = Math.min(gap, high - low);
  }
  return gap;
}

/** True when the angles are finite, strictly ascending and inside (0, π/2). */
export function isOrderedInQuarter(angles: readonly number[]): boolean {
  return angles.every(Number.isFinite) && smallestGap(angles) > 0;
}
