import { assertFiniteArray, assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertLossInputs } from './assertLossInputs.js';
import type { LossComparisonBasis, LossesByPowerFactorOptions } from './lossesByPowerFactor.js';
import {
  LOSS_ZERO_SEQUENCES,
  type LossOperatingPoint,
  type LossZeroSequence,
} from './lossTypes.js';

/** Most carrier periods per fundamental period a sweep integrates (bounds its cost). */
export const MAX_SWEEP_CARRIER_PERIODS = 5000;

/** Most power-factor angles one sweep evaluates. */
export const MAX_SWEEP_ANGLES = 1000;

/** A loss sweep's options once checked, with their defaults. */
export interface CheckedLossSweepOptions {
  point: Required<LossOperatingPoint>;
  /** Hz. */
  fundamentalFrequency: number;
  zeroSequences: readonly LossZeroSequence[];
  /** Power-factor angles, rad in [−π, π]. */
  angles: readonly number[];
  basis: LossComparisonBasis;
}

/**
 * Every check {@link lossesByPowerFactor} makes before its first sum, in the order it makes them
 * (the device's fields first, then the operating point, the fundamental, the basis, the zero
 * sequences, the angles and the carrier periods per fundamental period), so a caller can refuse
 * a bad request, naming its field, before it estimates or starts the work. Cheap: at most
 * {@link MAX_SWEEP_ANGLES} comparisons.
 * @throws ParameterRangeError or ParameterTypeError naming the field (`device.eon`, `angles[3]`,
 *   `points`, `zeroSequences[1]`, `switchingFrequency/fundamentalFrequency` above
 *   {@link MAX_SWEEP_CARRIER_PERIODS}, …)
 */
export function assertLossSweepOptions(
  options: LossesByPowerFactorOptions,
): CheckedLossSweepOptions {
  const {
    device,
    vdc,
    ma,
    peakCurrent,
    switchingFrequency,
    fundamentalFrequency = 50,
    zeroSequences = LOSS_ZERO_SEQUENCES,
    points = 100,
    basis = 'equal-carrier',
  } = options;
  const point = assertLossInputs(device, { vdc, ma, peakCurrent, switchingFrequency });
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: switchingFrequency / 3,
  });
  assertOneOf('basis', basis, ['equal-carrier', 'equal-switching'] as const);
  // Tested as unknown: Array.isArray would narrow a readonly array to any[] (TypeScript 17002).
  const givenSequences: unknown = zeroSequences;
  if (!Array.isArray(givenSequences) || zeroSequences.length === 0)
    throw new ParameterTypeError(
      'zeroSequences',
      `a list of 1 to ${LOSS_ZERO_SEQUENCES.length} zero sequences`,
      zeroSequences,
    );
  zeroSequences.forEach((z, i) => assertOneOf(`zeroSequences[${i}]`, z, LOSS_ZERO_SEQUENCES));
  const angles = options.angles ?? evenAngles(points);
  assertFiniteArray('angles', angles, 1, MAX_SWEEP_ANGLES);
  angles.forEach((a, i) => assertNumberInRange(`angles[${i}]`, a, { min: -Math.PI, max: Math.PI }));
  // 1.5× for the clamps with 'equal-switching': the largest carrier a sweep may run.
  const periods =
    (switchingFrequency / fundamentalFrequency) * (basis === 'equal-switching' ? 1.5 : 1);
  if (periods > MAX_SWEEP_CARRIER_PERIODS) {
    throw new ParameterRangeError(
      'switchingFrequency/fundamentalFrequency',
      `at most ${MAX_SWEEP_CARRIER_PERIODS}${basis === 'equal-switching' ? ' / 1.5' : ''} carrier periods per fundamental period`,
      switchingFrequency / fundamentalFrequency,
    );
  }
  return { point, fundamentalFrequency, zeroSequences, angles, basis };
}

/** `points` angles evenly over [−π/2, π/2], ends included. */
function evenAngles(points: number): number[] {
  assertNumberInRange('points', points, { min: 2, max: MAX_SWEEP_ANGLES, integer: true });
  return Array.from({ length: points }, (_, k) => -Math.PI / 2 + (Math.PI * k) / (points - 1));
}
