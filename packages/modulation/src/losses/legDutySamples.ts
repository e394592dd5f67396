import { clamp, TAU } from '../math.js';
import { threePhaseReference } from '../three-phase/threePhaseReference.js';
import { zeroSequenceOffset } from '../three-phase/zeroSequenceOffset.js';
import { dutyFromReference } from '../firmware/dutyFromReference.js';
import type { LossZeroSequence } from './lossTypes.js';

/** A duty this close to 0 or 1 (far below one timer count) is a clamp. */
const RAIL_TOLERANCE = 1e-12;

/**
 * Internal: the high-side duty of leg a of a three-phase bridge in each of `n` carrier periods of
 * one fundamental period, read at the period centres θ_j = (j + ½)·2π/n (regular sampling of the
 * carrier modulator's reference, ma·sin θ + z(θ), clamped to [0, 1] past the linear range).
 *
 * For `'gdpwm'` the 60° clamp of DPWM1 is decided at θ − ψ with ψ = currentAngle limited to
 * ±π/6, so the clamp centres on the current's peak at θ = π/2 + φ while |φ| ≤ 30°; the clamped
 * phase goes exactly to its rail as for DPWM1 (A. M. Hava, R. J. Kerkman, T. A. Lipo, IEEE
 * Trans. Power Electronics, 1998, from memory). ψ = −π/6 and π/6 give DPWM0 and DPWM2.
 *
 * The reduced common-mode methods have the duties of their modulation waves (min-max, DPWM1);
 * their carrier inversion does not change a period's duty.
 */
export function legDutySamples(
  zeroSequence: LossZeroSequence,
  ma: number,
  n: number,
  currentAngle: number,
): Float64Array {
  const duties = new Float64Array(n);
  // A clamped leg's reference is s + (1 − s), which rounding may leave an ulp off the rail:
  // snap such duties to the rail, so a clamped period counts as not switching.
  const snapped = (d: number): number => (d < RAIL_TOLERANCE ? 0 : d > 1 - RAIL_TOLERANCE ? 1 : d);
  if (zeroSequence === 'gdpwm') {
    const shift = clamp(currentAngle, -Math.PI / 6, Math.PI / 6);
    for (let j = 0; j < n; j++) {
      const theta = ((j + 0.5) * TAU) / n;
      const sines = [0, 1, 2].map((k) => ma * Math.sin(theta - (k * TAU) / 3)) as [
        number,
        number,
        number,
      ];
      duties[j] = snapped(
        dutyFromReference(sines[0] + zeroSequenceOffset('dpwm1', sines, theta - shift, ma)),
      );
    }
    return duties;
  }
  const reference = threePhaseReference(0, { ma, zeroSequence });
  for (let j = 0; j < n; j++)
    duties[j] = snapped(dutyFromReference(reference.value(((j + 0.5) * TAU) / n)));
  return duties;
}
