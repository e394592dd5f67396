import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import type { OptimalPulseSweepOptions } from './optimalPulseSweep.js';
import { resolvePulseBase } from './pulseOptions.js';
import { assertFirstQuarterAngles, assertFundamentalRange } from './validateShe.js';

/**
 * Asserts that `options` is a valid {@link optimalPulseSweep} request, without optimising
 * anything: every check {@link optimalPulseSweep} makes before its first search, over the whole
 * `fundamentals` range (both ends inside (0, limit) volts, the limit being the pattern's largest
 * fundamental; Patel and Hoft, IEEE Trans. Ind. Appl., 1973). A caller that runs a sweep in parts
 * (a job in chunks) checks the whole request with it before the first part.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field and its allowed range
 */
export function assertOptimalPulseSweepOptions(options: OptimalPulseSweepOptions): void {
  const { kind, vdc, count } = resolvePulseBase(options);
  const { fundamentals, maxAngleStep = 0.1, onProgress, previous } = options;
  assertFundamentalRange('fundamentals', fundamentals, kind, count, vdc);
  assertNumberInRange('maxAngleStep', maxAngleStep, { min: 0, minExclusive: true, max: 1 });
  if (onProgress !== undefined && typeof onProgress !== 'function') {
    throw new ParameterTypeError('onProgress', 'a function of the fraction done', onProgress);
  }
  if (previous !== undefined) {
    assertFirstQuarterAngles('previous', previous);
    if (previous.length !== count) {
      throw new ParameterRangeError('previous.length', `count = ${count}`, previous.length);
    }
  }
}
