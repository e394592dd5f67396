import { TAU } from '../math.js';

/**
 * The first of the S evenly spaced angles θ_j = (2π·j)/S, j = 0..S − 1, at or after `angle`
 * (radians), or S when none is: the sample at which a level that starts at `angle` takes over on
 * the grid. The test is θ_j ≥ angle with θ_j computed exactly as written, so a walk over a
 * waveform's segments by these indices assigns each sample the same level as testing every
 * sample against the next edge (θ_j is non-decreasing in j, so the answer is one boundary).
 * Internal: the segment walks of the sampled DC link and running integral.
 * @param angle - radians, finite
 * @param size - S, samples a period, an integer ≥ 1
 */
export function firstGridSampleFrom(angle: number, size: number): number {
  // The estimate is off by at most a sample either way from rounding; the two walks settle it.
  let j = Math.min(size, Math.max(0, Math.ceil((angle * size) / TAU)));
  while (j > 0 && (TAU * (j - 1)) / size >= angle) j--;
  while (j < size && (TAU * j) / size < angle) j++;
  return j;
}
