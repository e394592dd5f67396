import { SQRT3 } from '../math.js';
import type { ZeroSequence } from './ZeroSequence.js';

/** The modulation indices over which a reduced common-mode method does what it is for. */
export interface ReducedCommonModeRange {
  /** Smallest ma (peak reference / (vdc/2)) at which the common mode stays within ±vdc/6. */
  min: number;
  /** Largest ma of the linear range (no overmodulation): 2/√3, as for space vector. */
  max: number;
}

/**
 * The range of ma in which a reduced common-mode zero sequence keeps the common-mode voltage at
 * ±vdc/6 (no zero vector 000 or 111) and the line voltages linear; null for the other zero
 * sequences.
 *
 * - `azspwm1`: the min-max waves with the middle carrier inverted never give 000 or 111 (see
 *   {@link invertsCarrier}), at any ma: min 0.
 * - `nspwm`: while phase a is clamped high by the DPWM1 waves (θ in [60°, 120°)), r_a = 1 and
 *   r_b + r_c = s_b + s_c + 2 − 2·s_a = 2 − 3·s_a (s_b + s_c = −s_a). Legs b and c (one against
 *   the inverted carrier) are never high together while r_b + r_c ≤ 0, that is s_a ≥ 2/3 over
 *   the whole clamp, whose smallest s_a is ma·sin 60°: ma ≥ 4/(3√3) ≈ 0.7698, or in the index
 *   M = π·ma/4 of A. M. Hava and E. Ün (IEEE Trans. Power Electronics, 2009) M ≥ π/(3√3) ≈ 0.605,
 *   the "about 0.61" they give (from memory). Below it 111 and 000 return (±vdc/2).
 * - Both: linear to ma = 2/√3 (the space-vector limit, van der Broeck et al., 1988).
 */
export function reducedCommonModeRange(zeroSequence: ZeroSequence): ReducedCommonModeRange | null {
  if (zeroSequence === 'azspwm1') return { min: 0, max: 2 / SQRT3 };
  if (zeroSequence === 'nspwm') return { min: 4 / (3 * SQRT3), max: 2 / SQRT3 };
  return null;
}
