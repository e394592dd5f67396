import { ParameterRangeError } from '../validation/errors.js';
import { MAX_DESIGN_FREQUENCY_RATIO } from './designBounds.js';
import { designRationalRatio } from './designRationalRatio.js';
import type { InverterDesign } from './InverterDesign.js';

/** Relative distance from a whole number within which carrier/fundamental counts as whole (rounding of decimal inputs). */
const WHOLE_RATIO_TOLERANCE = 1e-9;

/**
 * The frequency ratio mf = carrierFrequency/fundamentalFrequency of a carrier design, a whole
 * number in [1, 1000] (rounded when within 1e−9 relative of one, so 2.5 kHz over 50 Hz is 50).
 * For a ratio that need not be whole see {@link designRationalRatio}.
 * @throws ParameterRangeError naming `carrierFrequency`
 */
export function designFrequencyRatio(
  design: Pick<InverterDesign, 'carrierFrequency' | 'fundamentalFrequency'>,
): number {
  const { carrierFrequency, fundamentalFrequency } = design;
  const { p, q, error } = designRationalRatio(design);
  // |ratio − p| ≤ 1e−9·ratio, stated in hertz: |p·f₁ − f_c| ≤ 1e−9·f_c, with f_c ≈ p·f₁.
  if (q !== 1 || Math.abs(error) > WHOLE_RATIO_TOLERANCE * p * fundamentalFrequency) {
    throw new ParameterRangeError(
      'carrierFrequency',
      `a whole multiple (1 to ${MAX_DESIGN_FREQUENCY_RATIO}) of fundamentalFrequency ${fundamentalFrequency} Hz, so the frequency ratio mf is a whole number`,
      carrierFrequency,
    );
  }
  return p;
}
