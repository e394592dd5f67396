import { wrapAngle } from '../math.js';

/** 30°, the grid on which every zero sequence here changes its form (radians). */
export const THIRTY_DEGREES = Math.PI / 6;

/**
 * Relative distance, in 30° widths, within which an angle is taken to lie exactly on a grid
 * boundary. Sample angles that are exact multiples of 30° in exact arithmetic (carrier peaks
 * and valleys when mf is a multiple of 6, say) come out of floating point a few ulp to either
 * side; without the snap, rounding would choose the side. Angles that are not on a boundary
 * lie at least π/(6·mf·…) away (rational positions), far above this.
 */
const BOUNDARY_SNAP = 1e-12;

/**
 * Index 0…11 of the 30° interval [k·π/6, (k + 1)·π/6) holding the fundamental angle `theta`
 * (radians, any finite value; wrapped into [0, 2π)). Half-open: an angle on a boundary belongs
 * to the interval that starts there, whichever phase, half period or clamp is asking, so a
 * decision taken from this index is exactly periodic in 2π/3 and flips exactly at θ + π.
 * Internal helper of the zero sequences (not exported by the package).
 */
export function thirtyDegreeSector(theta: number): number {
  let position = wrapAngle(theta) / THIRTY_DEGREES;
  const nearest = Math.round(position);
  if (Math.abs(position - nearest) < BOUNDARY_SNAP) position = nearest;
  return Math.floor(position) % 12;
}
