/**
 * Keeping first-quarter angles strictly ordered inside (0, π/2) during iterations (internal):
 * the fraction-to-boundary rule of interior-point methods (J. Nocedal and S. J. Wright,
 * *Numerical Optimization*, 2nd ed., 2006, §16.6 and §19.2) applied to the gaps
 * α₁ − 0, α_{k+1} − α_k, π/2 − α_N. The angles may be several patterns one after another
 * (`blockSize` angles each, for example one per cell of a cascaded bridge), each ordered on its own.
 */
import { HALF_PI } from '../math.js';

/** The lower end of gap k in the block of angles [start, end): 0 for the block's first gap. */
function gapLow(angles: readonly number[], start: number, k: number): number {
  return k === start ? 0 : (angles[k - 1] as number);
}

/** The upper end of gap k in the block of angles [start, end): π/2 for the block's last gap. */
function gapHigh(angles: readonly number[], end: number, k: number): number {
  return k === end ? HALF_PI : (angles[k] as number);
}

/** The largest t ≤ 1 such that α + t·δ keeps every gap above (1 − fraction) of its size. */
export function maxOrderedStep(
  angles: readonly number[],
  step: readonly number[],
  blockSize = angles.length,
  fraction = 0.9,
): number {
  let t = 1;
  for (let start = 0; start < angles.length; start += blockSize) {
    const end = Math.min(start + blockSize, angles.length);
    for (let k = start; k <= end; k++) {
      const shrink =
        (k === start ? 0 : (step[k - 1] as number)) - (k === end ? 0 : (step[k] as number));
      if (shrink > 0) {
        const gap = gapHigh(angles, end, k) - gapLow(angles, start, k);
        t = Math.min(t, (fraction * gap) / shrink);
      }
    }
  }
  return t;
}

/** The smallest gap between neighbouring angles, or to 0 and π/2, in radians. */
export function smallestGap(angles: readonly number[], blockSize = angles.length): number {
  let gap = Infinity;
  for (let start = 0; start < angles.length; start += blockSize) {
    const end = Math.min(start + blockSize, angles.length);
    for (let k = start; k <= end; k++)
      gap = Math.min(gap, gapHigh(angles, end, k) - gapLow(angles, start, k));
  }
  return gap;
}

/** True when the angles are finite, strictly ascending and inside (0, π/2), block by block. */
export function isOrderedInQuarter(angles: readonly number[], blockSize = angles.length): boolean {
  return angles.every(Number.isFinite) && smallestGap(angles, blockSize) > 0;
}
