/**
 * Keeping first-quarter angles strictly ordered inside (0, π/2) during iterations (internal):
 * the fraction-to-boundary rule of interior-point methods (J. Nocedal and S. J. Wright,
 * *Numerical Optimization*, 2nd ed., 2006, §16.6 and §19.2) applied to the gaps
 * α₁ − 0, α_{k+1} − α_k, π/2 − α_N. The angles may be several patterns one after another
 * (`blockSize` angles each, for example one per cell of a cascaded bridge), each ordered on its own.
 */
import { HALF_PI } from '../math.js';

/** Calls `visit(low, high, k)` for each gap of each block, k indexing the gap's upper angle. */
function forEachGap(
  angles: readonly number[],
  blockSize: number,
  visit: (low: number, high: number, lowIndex: number, highIndex: number) => void,
): void {
  for (let start = 0; start < angles.length; start += blockSize) {
    const end = Math.min(start + blockSize, angles.length);
    for (let k = start; k <= end; k++) {
      const low = k === start ? 0 : (angles[k - 1] as number);
      const high = k === end ? HALF_PI : (angles[k] as number);
      visit(low, high, k === start ? -1 : k - 1, k === end ? -1 : k);
    }
  }
}

/** The largest t ≤ 1 such that α + t·δ keeps every gap above (1 − fraction) of its size. */
export function maxOrderedStep(
  angles: readonly number[],
  step: readonly number[],
  blockSize = angles.length,
  fraction = 0.9,
): number {
  let t = 1;
  forEachGap(angles, blockSize, (low, high, lowIndex, highIndex) => {
    const dLow = lowIndex < 0 ? 0 : (step[lowIndex] as number);
    const dHigh = highIndex < 0 ? 0 : (step[highIndex] as number);
    const shrink = dLow - dHigh;
    if (shrink > 0) t = Math.min(t, (fraction * (high - low)) / shrink);
  });
  return t;
}

/** The smallest gap between neighbouring angles, or to 0 and π/2, in radians. */
export function smallestGap(angles: readonly number[], blockSize = angles.length): number {
  let gap = Infinity;
  forEachGap(angles, blockSize, (low, high) => {
    gap = Math.min(gap, high - low);
  });
  return gap;
}

/** True when the angles are finite, strictly ascending and inside (0, π/2), block by block. */
export function isOrderedInQuarter(angles: readonly number[], blockSize = angles.length): boolean {
  return angles.every(Number.isFinite) && smallestGap(angles, blockSize) > 0;
}
