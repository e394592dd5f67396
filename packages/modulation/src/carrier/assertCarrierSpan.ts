import { ParameterRangeError } from '../validation/errors.js';
import { assertNumberInRange } from '../validation/assertions.js';
import {
  assertCarrierOptions,
  MAX_FREQUENCY_RATIO,
  type CarrierOptionsInput,
} from './assertCarrierOptions.js';
import { MAX_SPAN_FUNDAMENTAL_PERIODS, type CarrierSpan } from './CarrierSpan.js';

/** Relative distance from a whole number within which q·mf counts as whole (decimal inputs). */
const WHOLE_TOLERANCE = 1e-9;

/**
 * Asserts the carrier options over a span of q fundamental periods and returns p = q·mf, the
 * carrier cycles in the span. With q = 1 the checks are exactly {@link assertCarrierOptions}'s
 * (mf a whole number); with q > 1, mf in [1, 10000] with q·mf whole and at most 10000.
 * Internal: shared by sineTriangle and threePhase.
 * @throws ParameterRangeError / ParameterTypeError naming `fundamentalPeriods`, `mf` or another field
 */
export function assertCarrierSpan(options: CarrierOptionsInput, span: CarrierSpan): number {
  const { fundamentalPeriods = 1 } = span;
  assertNumberInRange('fundamentalPeriods', fundamentalPeriods, {
    min: 1,
    max: MAX_SPAN_FUNDAMENTAL_PERIODS,
    integer: true,
  });
  if (fundamentalPeriods === 1) {
    assertCarrierOptions(options);
    return options.mf;
  }
  assertNumberInRange('mf', options.mf, { min: 1, max: MAX_FREQUENCY_RATIO });
  const cycles = fundamentalPeriods * options.mf;
  const whole = Math.round(cycles);
  if (Math.abs(cycles - whole) > WHOLE_TOLERANCE * cycles || whole > MAX_FREQUENCY_RATIO) {
    throw new ParameterRangeError(
      'mf',
      `a ratio p/${fundamentalPeriods} (fundamentalPeriods) with p a whole number of carrier cycles, at most ${MAX_FREQUENCY_RATIO}`,
      options.mf,
    );
  }
  assertCarrierOptions({ ...options, mf: whole });
  return whole;
}
