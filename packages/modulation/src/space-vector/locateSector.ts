import { wrapAngle } from '../math.js';

/** π/3, the angle a sector spans. */
export const SECTOR_ANGLE = Math.PI / 3;

/**
 * Relative distance (in sector widths) within which an angle is taken to lie exactly on a
 * sector boundary, so sampled angles such as 2πk/N that should land on a boundary are not
 * thrown into the neighbouring sector by one rounding step (affects results by < 1e−12).
 */
const BOUNDARY_SNAP = 1e-12;

/**
 * Sector (1…6) of a space-vector angle and the angle within it, in [0, π/3) radians.
 * Internal helper of the space-vector functions (not exported by the package).
 */
export function locateSector(theta: number): { sector: number; angle: number } {
  let position = wrapAngle(theta) / SECTOR_ANGLE;
  const nearest = Math.round(position);
  if (Math.abs(position - nearest) < BOUNDARY_SNAP) position = nearest;
  const index = Math.floor(position);
  const sectorIndex = index % 6;
  return { sector: sectorIndex + 1, angle: (position - index) * SECTOR_ANGLE };
}
