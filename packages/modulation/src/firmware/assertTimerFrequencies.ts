import { assertNumberInRange } from '../validation/assertions.js';

/**
 * Internal to the timer tables (two-level and multilevel): asserts the three frequencies every
 * table takes, hertz: the fundamental in (0, 10⁶], the timer clock in (0, 10¹¹] and the carrier
 * in (0, clock/2] (a carrier period needs at least two ticks).
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field
 */
export function assertTimerFrequencies(frequencies: {
  fundamentalFrequency: unknown;
  carrierFrequency: unknown;
  timerClock: unknown;
}): void {
  const { fundamentalFrequency, carrierFrequency, timerClock } = frequencies;
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: 1e6,
  });
  assertNumberInRange('timerClock', timerClock, { min: 0, minExclusive: true, max: 1e11 });
  assertNumberInRange('carrierFrequency', carrierFrequency, {
    min: 0,
    minExclusive: true,
    max: timerClock / 2,
  });
}
