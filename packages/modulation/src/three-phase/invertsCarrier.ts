import {
  carrierAngle,
  fundamentalAngleOfCarrier,
  type CarrierAlignment,
} from '../carrier/triangleCarrier.js';
import { middlePhase } from './middlePhase.js';
import type { PhaseIndex } from './threePhaseReference.js';
import type { ZeroSequence } from './ZeroSequence.js';

/**
 * True when phase `phase` (0, 1, 2 = a, b, c, references at θ − k·2π/3) compares its reference
 * with the inverted carrier at the fundamental angle `theta` (radians, any finite value): only
 * for the reduced common-mode methods `azspwm1` and `nspwm`, and only while that phase is the
 * middle one of the three sine references (A. M. Hava and E. Ün, IEEE Trans. Power Electronics,
 * 2009, from memory). The middle phase changes where two sines are equal, at odd multiples of
 * 30°; it is decided once per carrier half period, at its centre (the carrier's zero crossing),
 * so the carriers are swapped only at a carrier peak or valley, as a controller that sets its
 * carriers once per half period does. A swap there moves no volt-seconds: over the half period
 * either side of a peak or valley, a held reference spends as long above the carrier as above
 * the inverted one.
 *
 * Why it reduces the common mode: a leg is high while its reference r exceeds its carrier c
 * (±1 units). With the middle leg against −c, the max and middle legs are both low only if
 * r_max + r_mid < 0, and the middle and min legs both high only if r_mid + r_min > 0. For the
 * min-max waves r_max + r_mid = s_mid − s_min ≥ 0 and r_mid + r_min = s_mid − s_max ≤ 0 at every
 * instant (s the sines), so 000 and 111 never occur; for the DPWM1 waves the clamped leg holds
 * its rail and the other two never meet while ma ≥ 4/(3√3) ({@link reducedCommonModeRange}).
 * Inverting a triangle carrier is the same as delaying it by half a carrier period.
 *
 * @param alignment - the carrier (frequency ratio and phase) the legs share
 */
export function invertsCarrier(
  zeroSequence: ZeroSequence,
  phase: PhaseIndex,
  theta: number,
  alignment: CarrierAlignment,
): boolean {
  if (zeroSequence !== 'azspwm1' && zeroSequence !== 'nspwm') return false;
  const half = Math.floor(carrierAngle(theta, alignment) / Math.PI);
  const centre = fundamentalAngleOfCarrier((half + 0.5) * Math.PI, alignment);
  return middlePhase(centre) === phase;
}
