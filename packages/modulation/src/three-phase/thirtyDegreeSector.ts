import { wrapAngle } from '../math.js';

/** 30°, the grid on which every zero sequence here changes its form (radians). */
export const THIRTY_DEGREES = Math.PI / 6;

/**
 * Index 0…11 of the half-open 30° interval [k·π/6, (k + 1)·π/6) holding the fundamental angle
 * `theta` (radians, any finite value; wrapped into [0, 2π)). A decision taken from this index
 * rather than from comparing sines is exactly 2π/3-periodic and flips at θ + π, and stays
 * right a few ulp inside an interval, where `compareWithCarrier`'s crossing search reads each
 * piece of the reference (the sines' difference there is below their rounding). Within rounding
 * of a boundary, rounding of θ picks the side; the comparator never asks there (a held sample
 * that falls on a breakpoint is read just after it, in the interval that starts there).
 * Internal helper of the zero sequences (not exported by the package).
 */
export function thirtyDegreeSector(theta: number): number {
  return Math.floor(wrapAngle(theta) / THIRTY_DEGREES) % 12;
}
