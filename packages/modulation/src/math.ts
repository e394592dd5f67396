/**
 * Shared constants and tolerances of the modulation library.
 *
 * Angles are radians of the fundamental; one period is [0, TAU).
 */

/** One full fundamental period in radians, 2π. */
export const TAU = 2 * Math.PI;

/** π/2, a quarter of the fundamental period in radians. */
export const HALF_PI = Math.PI / 2;

/** √3, the ratio of line-to-line to phase amplitude in a balanced three-phase set. */
export const SQRT3 = Math.sqrt(3);

/**
 * Two switching angles closer than this (radians) are treated as one edge and the
 * zero-width pulse between them is dropped. At 2^-40 rad the volt-seconds lost are far below
 * any harmonic the library reports (a pulse that narrow contributes < 1e-12 of vdc).
 */
export const EDGE_EPSILON = 2 ** -40;

/**
 * Wraps an angle into [0, 2π).
 * @param angle - radians, any finite value
 * @returns the equivalent angle in [0, 2π)
 */
export function wrapAngle(angle: number): number {
  const wrapped = angle - TAU * Math.floor(angle / TAU);
  // Floating point can round a tiny negative angle up to exactly TAU.
  return wrapped >= TAU ? 0 : wrapped;
}

/** Clamps `value` into [min, max]. */
export function clamp(value: number, min: number, max: number): number {
  return value < min ? min : value > max ? max : value;
}
