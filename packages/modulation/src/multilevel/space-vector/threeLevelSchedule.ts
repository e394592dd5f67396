import { HALF_PI, TAU } from '../../math.js';
import {
  MAX_SPACE_VECTOR_PERIODS,
  SPACE_VECTOR_SAMPLINGS,
} from '../../space-vector/spaceVectorWaveforms.js';
import { assertNumberInRange, assertOneOf } from '../../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import { threeLevelHalfPeriod } from './threeLevelHalfPeriod.js';
import { threeLevelSpaceVector } from './threeLevelSpaceVector.js';
import type {
  ThreeLevelModulationOptions,
  ThreeLevelSpaceVectorSelection,
  ThreeLevelSwitchingState,
} from './threeLevelSpaceVectorTypes.js';

/** One sample of the reference and the vectors selected for it. */
export interface ThreeLevelSample {
  /** Fundamental angle of the sample, radians in [0, 2π); the phase-a reference is ∝ sin θ. */
  theta: number;
  selection: ThreeLevelSpaceVectorSelection;
}

/** One switching period: its samples and the eight segments of its two halves. */
export interface ThreeLevelPeriod {
  /** One sample (symmetric sampling) or two (asymmetric: start and middle). */
  samples: ThreeLevelSample[];
  /** First half N-type … P-type form, second half P-type … N-type form. */
  states: ThreeLevelSwitchingState[];
  /** Fractions of the switching period, summing to 1 (zeros kept). */
  durations: number[];
}

/** The switching periods of one fundamental period. */
export interface ThreeLevelSchedule {
  m: number;
  ma: number;
  periods: ThreeLevelPeriod[];
}

/**
 * Validates the options and lays out every switching period of one fundamental period: period k
 * spans [k, k + 1)·2π/N, N = frequencyRatio; its samples are taken at its start (and middle)
 * with the reference vector at angle θ − π/2 (so the phase-a reference is (m·vdc/√3)·sin θ, as
 * for two levels). Internal helper of the three-level space-vector functions.
 *
 * @throws ParameterTypeError when options is not an object
 * @throws ParameterRangeError naming `m`, `ma`, `frequencyRatio`, `sampling` or
 *   `smallVectorSplit` and the allowed range
 */
export function threeLevelSchedule(options: ThreeLevelModulationOptions): ThreeLevelSchedule {
  if (typeof options !== 'object' || options === null) {
    throw new ParameterTypeError('options', 'an object', options);
  }
  const { frequencyRatio, sampling = 'symmetric', smallVectorSplit = 0.5 } = options;
  const { m, ma } = threeLevelIndices(options);
  assertNumberInRange('frequencyRatio', frequencyRatio, {
    min: 1,
    max: MAX_SPACE_VECTOR_PERIODS,
    integer: true,
  });
  assertOneOf('sampling', sampling, SPACE_VECTOR_SAMPLINGS);
  assertNumberInRange('smallVectorSplit', smallVectorSplit, { min: 0, max: 1 });
  const n = frequencyRatio;
  const sample = (theta: number): ThreeLevelSample => ({
    theta,
    selection: threeLevelSpaceVector({ m, theta: theta - HALF_PI, smallVectorSplit }),
  });
  const periods: ThreeLevelPeriod[] = [];
  for (let k = 0; k < n; k++) {
    const samples = [sample((TAU * k) / n)];
    if (sampling === 'asymmetric') samples.push(sample((TAU * (2 * k + 1)) / (2 * n)));
    const first = threeLevelHalfPeriod((samples[0] as ThreeLevelSample).selection);
    const second = threeLevelHalfPeriod(
      (samples[samples.length - 1] as ThreeLevelSample).selection,
    );
    periods.push({
      samples,
      states: [...first.states, ...[...second.states].reverse()],
      durations: [...first.durations, ...[...second.durations].reverse()],
    });
  }
  return { m, ma, periods };
}

/** Both forms of the index from exactly one of them, ma = 2m/√3, within the linear range. */
function threeLevelIndices({ m, ma }: ThreeLevelModulationOptions): { m: number; ma: number } {
  if (m !== undefined && ma !== undefined) {
    throw new ParameterRangeError('ma', 'omitted when m is given (give one of m and ma)', ma);
  }
  if (ma !== undefined) {
    assertNumberInRange('ma', ma, { min: 0, max: 2 / Math.sqrt(3) });
    return { m: Math.min(1, (Math.sqrt(3) * ma) / 2), ma };
  }
  if (m === undefined) throw new ParameterRangeError('m', 'given (or ma instead)', m);
  assertNumberInRange('m', m, { min: 0, max: 1 });
  return { m, ma: (2 * m) / Math.sqrt(3) };
}
