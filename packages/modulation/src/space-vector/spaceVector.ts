import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { SECTOR_ANGLE, locateSector } from './locateSector.js';
import { HEXAGON_VERTEX_M } from './spaceVectorLimits.js';
import type { SpaceVectorDwell, SpaceVectorReference } from './spaceVectorTypes.js';

/** Dwell sums above 1 by no more than this are rounding on the hexagon's edge, not errors. */
const HEXAGON_TOLERANCE = 1e-12;

/**
 * Sector and dwell times of a reference space vector, as fractions of the switching period.
 *
 * With θ' the angle within the sector (θ wrapped into [0, 2π), sector k = ⌊θ/(π/3)⌋ + 1):
 * t1 = m·sin(π/3 − θ'), t2 = m·sin(θ'), t0 = 1 − t1 − t2, where m = √3·|Vref|/vdc, so that
 * t1·Vk + t2·Vk+1 = Vref with |Vk| = 2vdc/3 (H. W. van der Broeck, H.-C. Skudelny,
 * G. V. Stanke, "Analysis and realization of a pulsewidth modulator based on voltage space
 * vectors", IEEE Trans. Ind. Appl., 1988; Holmes and Lipo 2003, ch. 5).
 *
 * Range: m ≤ 1 (|Vref| ≤ vdc/√3) is the linear range, valid at every angle. Larger m up to the
 * hexagon, m ≤ 1/cos(θ' − π/6) (at most 2/√3 at a vertex), is accepted because a single
 * switching period can realise it (t0 = 0 on the hexagon's edge); the overmodulation functions
 * rely on that. A vector outside the hexagon cannot be realised and throws: reduce m or shape
 * the reference with {@link overmodulatedReference} first.
 *
 * @param reference - `{ m, theta }`: m ≥ 0 (see above), theta radians, any finite value
 * @returns `{ sector, t1, t2, t0 }`, each time in [0, 1], summing to 1
 * @throws ParameterTypeError when reference is not an object
 * @throws ParameterRangeError naming `m` or `theta` and the allowed range
 */
export function spaceVector(reference: SpaceVectorReference): SpaceVectorDwell {
  if (typeof reference !== 'object' || reference === null) {
    throw new ParameterTypeError('reference', 'an object { m, theta }', reference);
  }
  const { m, theta } = reference;
  assertNumberInRange('m', m, { min: 0, max: HEXAGON_VERTEX_M });
  assertNumberInRange('theta', theta);
  const { sector, angle } = locateSector(theta);
  let t1 = m * Math.sin(SECTOR_ANGLE - angle);
  let t2 = m * Math.sin(angle);
  const active = t1 + t2;
  if (active > 1 + HEXAGON_TOLERANCE) {
    const limit = 1 / Math.cos(angle - SECTOR_ANGLE / 2);
    throw new ParameterRangeError(
      'm',
      `a finite number in [0, ${limit}] at theta = ${theta} rad (inside the hexagon; m ≤ 1 is ` +
        'the linear range at every angle; for larger m use overmodulatedReference)',
      m,
    );
  }
  if (active > 1) {
    t1 /= active;
    t2 /= active;
  }
  return { sector, t1, t2, t0: Math.max(0, 1 - t1 - t2) };
}
