import { ParameterRangeError } from '../validation/errors.js';
import { assertNumberInRange } from '../validation/assertions.js';

/** Relative tolerance for q·frequencyRatio to count as an integer (decimal inputs like 7.2). */
const INTEGER_TOLERANCE = 1e-9;

/** Whole numbers of switching and fundamental periods after which the pattern repeats. */
export interface RepeatingSpan {
  /** N: switching periods in the span. */
  switchingPeriods: number;
  /** q: fundamental periods in the span (1 for an integer frequency ratio). */
  fundamentalPeriods: number;
}

/**
 * The shortest span of q fundamental periods holding a whole number N = q·frequencyRatio of
 * switching periods, q ≤ maxFundamentalPeriods. Internal helper of the waveform builder.
 * @throws ParameterRangeError naming `frequencyRatio` when no such q exists or N is too large
 */
export function rationalFrequencyRatio(
  frequencyRatio: number,
  maxFundamentalPeriods: number,
  maxSwitchingPeriods: number,
): RepeatingSpan {
  assertNumberInRange('frequencyRatio', frequencyRatio, { min: 1 });
  for (let q = 1; q <= maxFundamentalPeriods; q++) {
    const periods = q * frequencyRatio;
    const whole = Math.round(periods);
    if (Math.abs(periods - whole) <= INTEGER_TOLERANCE * periods) {
      if (whole > maxSwitchingPeriods) break;
      return { switchingPeriods: whole, fundamentalPeriods: q };
    }
  }
  throw new ParameterRangeError(
    'frequencyRatio',
    `a ratio p/q ≥ 1 with q ≤ ${maxFundamentalPeriods} (maxFundamentalPeriods) and p ≤ ` +
      `${maxSwitchingPeriods} switching periods in the repeating span`,
    frequencyRatio,
  );
}
