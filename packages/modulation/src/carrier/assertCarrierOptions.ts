import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { CARRIER_SAMPLINGS, type CarrierSampling } from './CarrierSampling.js';

/** The largest frequency ratio accepted; bounds the cost of one waveform (4·mf edges). */
export const MAX_FREQUENCY_RATIO = 10_000;

/** The largest modulation index accepted; far past the point where PWM becomes a square wave. */
export const MAX_MODULATION_INDEX = 1_000;

/** Options shared by every carrier-based method. */
export interface CarrierOptionsInput {
  ma: unknown;
  mf: unknown;
  vdc: unknown;
  sampling?: unknown;
  carrierPhase?: unknown;
}

/**
 * Asserts the options every carrier-based method shares: `ma` in (0, 1000], `mf` an integer in
 * [1, 10000], `vdc` > 0, `sampling` one of {@link CARRIER_SAMPLINGS}, `carrierPhase` finite.
 * @throws ParameterRangeError / ParameterTypeError naming the field and its range
 */
export function assertCarrierOptions(options: CarrierOptionsInput): asserts options is {
  ma: number;
  mf: number;
  vdc: number;
  sampling?: CarrierSampling;
  carrierPhase?: number;
} {
  assertNumberInRange('ma', options.ma, { min: 0, minExclusive: true, max: MAX_MODULATION_INDEX });
  assertNumberInRange('mf', options.mf, { min: 1, max: MAX_FREQUENCY_RATIO, integer: true });
  assertNumberInRange('vdc', options.vdc, { min: 0, minExclusive: true });
  if (options.sampling !== undefined) assertOneOf('sampling', options.sampling, CARRIER_SAMPLINGS);
  if (options.carrierPhase !== undefined) assertNumberInRange('carrierPhase', options.carrierPhase);
}
