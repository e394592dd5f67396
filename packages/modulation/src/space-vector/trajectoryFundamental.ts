import { SECTOR_ANGLE } from './locateSector.js';
import { HEXAGON_VERTEX_M } from './spaceVectorLimits.js';

/** Simpson intervals over a sector for mode II; the integrand is smooth, error < 1e−13. */
const SIMPSON_INTERVALS = 1024;

/**
 * Fundamental (m units) of Holtz's mode-I trajectory traversed at uniform angular speed: the
 * circle of radius `radius` where it lies inside the hexagon, the hexagon's side elsewhere.
 * The fundamental of a vector ρ(α)·e^{jα} with α = ωt is the mean of ρ; over the half-sector
 * from the side's middle, ρ = sec α up to α_c = arccos(1/radius) and `radius` after, so
 * F = (6/π)·[ln(sec α_c + tan α_c) + radius·(π/6 − α_c)] (standard integral of sec).
 * Internal helper; radius in [1, 2/√3].
 */
export function modeOneFundamental(radius: number): number {
  const crossing = Math.acos(Math.min(1, 1 / radius));
  const alongSide = Math.log(1 / Math.cos(crossing) + Math.tan(crossing));
  return (6 / Math.PI) * (alongSide + radius * (SECTOR_ANGLE / 2 - crossing));
}

/**
 * The reference angle within a sector after Holtz's mode-II angle hold (Holtz, Lotzkat,
 * Khambadkone, IEEE Trans. Power Electron., 1993): held at Vk for α < αh, at Vk+1 for
 * α ≥ π/3 − αh, and in between moving along the hexagon's side with
 * α_p = (α − αh)·(π/6)/(π/6 − αh). α, αh in radians; α in [0, π/3), αh in [0, π/6].
 * Internal helper.
 */
export function heldAngle(angle: number, holdingAngle: number): number {
  const half = SECTOR_ANGLE / 2;
  // Six-step jumps at mid-sector, and the middle belongs to the second half: the rule of
  // locateSector, whose angle (snapped onto the π/6 grid within rounding) arrives here, so a
  // sample 2πk/N that should land on the jump (N a multiple of 6) is exactly on it.
  if (holdingAngle >= half) return angle < half ? 0 : SECTOR_ANGLE;
  if (angle < holdingAngle) return 0;
  if (angle >= SECTOR_ANGLE - holdingAngle) return SECTOR_ANGLE;
  return ((angle - holdingAngle) * half) / (half - holdingAngle);
}

/**
 * Fundamental (m units) of Holtz's mode-II trajectory with holding angle αh: by the sector's
 * symmetry c₁ = (3/π)·∫₀^{π/3} ρ(α_p)·cos(α_p − α) dα, with ρ = 2/√3 on the holds (which give
 * (3/π)·(4/√3)·sin αh in closed form) and ρ = sec(α_p − π/6) on the side (Simpson's rule).
 * Gives (3/π)·ln 3 at αh = 0 and the six-step 2√3/π at αh = π/6. Internal helper.
 */
export function modeTwoFundamental(holdingAngle: number): number {
  const holds = 2 * HEXAGON_VERTEX_M * Math.sin(holdingAngle);
  const start = holdingAngle;
  const end = SECTOR_ANGLE - holdingAngle;
  let side = 0;
  if (end > start) {
    const step = (end - start) / SIMPSON_INTERVALS;
    for (let i = 0; i <= SIMPSON_INTERVALS; i++) {
      const alpha = start + i * step;
      const moved = heldAngle(alpha, holdingAngle);
      const value = Math.cos(moved - alpha) / Math.cos(moved - SECTOR_ANGLE / 2);
      const weight = i === 0 || i === SIMPSON_INTERVALS ? 1 : i % 2 === 1 ? 4 : 2;
      side += weight * value;
    }
    side *= step / 3;
  }
  return (3 / Math.PI) * (holds + side);
}
