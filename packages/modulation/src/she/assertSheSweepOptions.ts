import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterTypeError } from '../validation/errors.js';
import { assertSquare, resolveSheBase } from './sheOptions.js';
import type { SheSweepOptions } from './sheSweep.js';
import { assertCellVoltages, assertFundamentalRange } from './validateShe.js';

/**
 * Asserts that `options` is a valid {@link sheSweep} request, without solving anything: every
 * check {@link sheSweep} makes before its first solve, over the whole `fundamentals` range (both
 * ends inside (0, limit) volts, the limit being the pattern's largest fundamental, 4·vdc/π for
 * the bipolar kind, 4ΣV_k/π for a staircase of `cellVoltages`; Patel and Hoft, IEEE Trans. Ind.
 * Appl., 1973). A caller that runs a sweep in
 * parts (a job in chunks) checks the whole request with it before the first part.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field and its allowed range
 */
export function assertSheSweepOptions(options: SheSweepOptions): void {
  const { kind, vdc, count, eliminate } = resolveSheBase(options);
  const { fundamentals, maxHalvings = 8, maxAngleStep = 0.1, maxBranches = 8 } = options;
  const { cellVoltages } = options;
  assertSquare(eliminate, count, true);
  if (cellVoltages !== undefined) assertCellVoltages('cellVoltages', cellVoltages, kind, count);
  assertFundamentalRange('fundamentals', fundamentals, kind, count, vdc, cellVoltages);
  assertNumberInRange('maxHalvings', maxHalvings, { min: 0, max: 30, integer: true });
  assertNumberInRange('maxAngleStep', maxAngleStep, { min: 0, minExclusive: true, max: 1 });
  assertNumberInRange('maxBranches', maxBranches, { min: 1, max: 100, integer: true });
  const { onProgress } = options;
  if (onProgress !== undefined && typeof onProgress !== 'function') {
    throw new ParameterTypeError('onProgress', 'a function of the fraction done', onProgress);
  }
}
