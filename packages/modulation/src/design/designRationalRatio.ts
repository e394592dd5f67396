import { bestRationalApproximation } from '../numeric/bestRationalApproximation.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import {
  DESIGN_BOUNDS,
  MAX_DESIGN_FREQUENCY_RATIO,
  MAX_DESIGN_FUNDAMENTAL_PERIODS,
} from './designBounds.js';
import type { InverterDesign } from './InverterDesign.js';

/** A design's frequency ratio as a fraction, and how far it moves the carrier. */
export interface RationalRatio {
  /** p: carrier cycles in the repeating span. */
  p: number;
  /** q: fundamental periods in the repeating span, 1 to {@link MAX_DESIGN_FUNDAMENTAL_PERIODS}. */
  q: number;
  /**
   * The carrier frequency analysed minus the one asked for, p/q·fundamentalFrequency −
   * carrierFrequency, hertz: 0 (to rounding) when the ratio is exactly p/q.
   */
  error: number;
}

/**
 * The frequency ratio carrierFrequency/fundamentalFrequency of a carrier design as the fraction
 * p/q nearest to it with q ≤ 64 (`bestRationalApproximation`: continued fractions, a fact of
 * number theory). A synchronous carrier gives q = 1; a fixed carrier at a fundamental that is
 * no such fraction (an asynchronous ratio) gives the nearest one that is, and `error` states in
 * hertz how far the carrier analysed is from the one asked for. The ratio must lie in
 * [1, 1000].
 * @throws ParameterRangeError naming `carrierFrequency`
 */
export function designRationalRatio(
  design: Pick<InverterDesign, 'carrierFrequency' | 'fundamentalFrequency'>,
): RationalRatio {
  const { carrierFrequency, fundamentalFrequency } = design;
  assertNumberInRange('carrierFrequency', carrierFrequency, DESIGN_BOUNDS.carrierFrequency);
  const ratio = carrierFrequency / fundamentalFrequency;
  // The 1e−9 margin lets decimal rounding of an end of the range through, as for whole ratios.
  const margin = 1 + 1e-9;
  if (!(ratio * margin >= 1 && ratio <= MAX_DESIGN_FREQUENCY_RATIO * margin)) {
    throw new ParameterRangeError(
      'carrierFrequency',
      `1 to ${MAX_DESIGN_FREQUENCY_RATIO} times fundamentalFrequency ${fundamentalFrequency} Hz (the frequency ratio mf)`,
      carrierFrequency,
    );
  }
  const { p, q } = bestRationalApproximation(ratio, MAX_DESIGN_FUNDAMENTAL_PERIODS);
  return { p, q, error: (p / q) * fundamentalFrequency - carrierFrequency };
}
