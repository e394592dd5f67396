import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import { DESIGN_BOUNDS, MAX_DESIGN_FREQUENCY_RATIO } from './designBounds.js';
import type { InverterDesign } from './InverterDesign.js';

/** Relative distance from a whole number within which carrier/fundamental counts as whole (rounding of decimal inputs). */
const WHOLE_RATIO_TOLERANCE = 1e-9;

/**
 * The frequency ratio mf = carrierFrequency/fundamentalFrequency of a carrier design, a whole
 * number in [1, 1000] (rounded when within 1e−9 relative of one, so 2.5 kHz over 50 Hz is 50).
 * @throws ParameterRangeError naming `carrierFrequency`
 */
export function designFrequencyRatio(
  design: Pick<InverterDesign, 'carrierFrequency' | 'fundamentalFrequency'>,
): number {
  const { carrierFrequency, fundamentalFrequency } = design;
  assertNumberInRange('carrierFrequency', carrierFrequency, DESIGN_BOUNDS.carrierFrequency);
  const ratio = carrierFrequency / fundamentalFrequency;
  const whole = Math.round(ratio);
  if (
    whole < 1 ||
    whole > MAX_DESIGN_FREQUENCY_RATIO ||
    Math.abs(ratio - whole) > WHOLE_RATIO_TOLERANCE * ratio
  ) {
    throw new ParameterRangeError(
      'carrierFrequency',
      `a whole multiple (1 to ${MAX_DESIGN_FREQUENCY_RATIO}) of fundamentalFrequency ${fundamentalFrequency} Hz, so the frequency ratio mf is a whole number`,
      carrierFrequency,
    );
  }
  return whole;
}
