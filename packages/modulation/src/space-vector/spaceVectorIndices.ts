import { ParameterRangeError } from '../validation/errors.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { SIX_STEP_M } from './spaceVectorLimits.js';

/** The two forms of a space-vector modulation index. */
export interface SpaceVectorIndices {
  /** m = √3·|V1|/vdc, in [0, 2√3/π]; 1 ends the linear range. */
  m: number;
  /** The carrier-style index ma = 2·|V1|/vdc = 2m/√3, in [0, 4/π]. */
  ma: number;
}

/**
 * Both forms of a space-vector modulation index from exactly one of them, ma = 2m/√3 (the
 * phase fundamental |V1| = m·vdc/√3 = ma·vdc/2; van der Broeck, Skudelny, Stanke, 1988).
 * @throws ParameterRangeError naming `m` or `ma`: both or neither given, or out of range
 */
export function spaceVectorIndices({
  m,
  ma,
}: {
  m?: number | undefined;
  ma?: number | undefined;
}): SpaceVectorIndices {
  if (m !== undefined && ma !== undefined) {
    throw new ParameterRangeError('ma', 'omitted when m is given (give one of m and ma)', ma);
  }
  let index: number;
  if (ma !== undefined) {
    assertNumberInRange('ma', ma, { min: 0, max: (2 * SIX_STEP_M) / Math.sqrt(3) });
    index = Math.min(SIX_STEP_M, (Math.sqrt(3) * ma) / 2);
  } else {
    if (m === undefined) throw new ParameterRangeError('m', 'given (or ma instead)', m);
    assertNumberInRange('m', m, { min: 0, max: SIX_STEP_M });
    index = m;
  }
  return { m: index, ma: (2 * index) / Math.sqrt(3) };
}
