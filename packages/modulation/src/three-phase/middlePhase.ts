import { thirtyDegreeSector } from './thirtyDegreeSector.js';
import type { PhaseIndex } from './threePhaseReference.js';

/** The middle phase of the three sine references in each 60° interval [30° + k·60°, 90° + k·60°), from k = −1. */
const MIDDLE_PHASE: readonly PhaseIndex[] = [0, 2, 1, 0, 2, 1];

/**
 * Internal helper of the reduced common-mode methods (not exported by the package): the phase
 * (0, 1, 2 = a, b, c, references at θ − k·2π/3) whose sine reference is the middle one of the
 * three at the fundamental angle `theta` (radians, any finite value). The order of the sines
 * changes where two are equal, at odd multiples of 30°; the answer is read from the 30° interval
 * ({@link thirtyDegreeSector}), so it is exactly 2π/3-periodic, and within rounding of a boundary
 * rounding of θ picks the side.
 */
export function middlePhase(theta: number): PhaseIndex {
  return MIDDLE_PHASE[Math.floor(((thirtyDegreeSector(theta) + 1) % 12) / 2)] as PhaseIndex;
}
