import { wrapAngle } from '../math.js';

/** π/3, the angle a sector spans. */
export const SECTOR_ANGLE = Math.PI / 3;

/** π/6, half a sector: the grid of sector boundaries and sector middles. */
const HALF_SECTOR = SECTOR_ANGLE / 2;

/**
 * Distance, in half-sector widths, within which an angle is taken to lie exactly on the π/6
 * grid (a sector boundary or a sector's middle), so sampled angles such as 2πk/N that should
 * land there are not thrown to either side by one rounding step. 2e-12 half sectors is
 * 1.05e-12 rad; a sample at k/N of a span of N switching periods (or at a half period) that is
 * not on the grid is at least π/(6N) ≥ 5e-6 rad away for the N ≤ 100 000 the waveform builder
 * accepts, so the snap decides only true ties (affects results by < 1e−12).
 */
const BOUNDARY_SNAP = 2e-12;

/** Where a space-vector angle lies among the sectors. */
export interface SectorLocation {
  /** Sector 1…6, [(k − 1)·π/3, k·π/3). */
  sector: number;
  /** Angle within the sector, [0, π/3) radians. */
  angle: number;
  /**
   * True in the sector's second half, [π/6, π/3), nearer V(k+1) than Vk (t2 ≥ t1); the middle
   * itself belongs to the second half.
   */
  secondHalf: boolean;
}

/**
 * Sector (1…6) of a space-vector angle, the angle within it in [0, π/3) radians, and which half
 * of the sector it is in. Every decision on the π/6 grid is taken here, by one rule: intervals
 * are half-open, [start, end), so a boundary or a sector's middle belongs to the interval that
 * starts there, and an angle within {@link BOUNDARY_SNAP} of the grid counts as on it. Applied
 * alike at θ, θ + 2π/3 and θ + π, the rule keeps a sampled waveform's three-phase and half-wave
 * symmetry exact when samples land on the grid (frequency ratios that are multiples of 6 or
 * 12). Internal helper of the space-vector functions (not exported by the package).
 */
export function locateSector(theta: number): SectorLocation {
  let position = wrapAngle(theta) / HALF_SECTOR;
  const nearest = Math.round(position);
  if (Math.abs(position - nearest) < BOUNDARY_SNAP) position = nearest;
  // position is in [0, 12]; 12 (a hair below 2π, snapped) is the start of sector 1.
  const index = Math.floor(position);
  const sectorStart = index - (index % 2);
  return {
    sector: ((sectorStart / 2) % 6) + 1,
    angle: (position - sectorStart) * HALF_SECTOR,
    secondHalf: index % 2 === 1,
  };
}
