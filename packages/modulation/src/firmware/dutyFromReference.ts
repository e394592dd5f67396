import { clamp } from '../math.js';

/**
 * Duty cycle of a leg's high-side switch for a normalised reference `r` (units of vdc/2):
 * `(1 + r)/2` clamped to [0, 1] (the average leg voltage over one carrier period is then
 * `r·vdc/2` relative to the DC midpoint; the clamp is overmodulation). Common practice.
 */
export function dutyFromReference(r: number): number {
  return clamp((1 + r) / 2, 0, 1);
}
