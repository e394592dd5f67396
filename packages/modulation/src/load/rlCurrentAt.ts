import { wrapAngle } from '../math.js';
import { assertFiniteArray } from '../validation/assertions.js';
import { assertWaveform } from '../waveform/assertWaveform.js';
import type { Waveform } from '../waveform/Waveform.js';
import { assertRlLoad } from './assertRlLoad.js';
import type { RlLoadOptions } from './RlLoad.js';
import { nonFiniteLoadError } from './nonFiniteLoadError.js';
import {
  currentInSegment,
  rlPiecewiseSolution,
  segmentIndexAt,
  type RlSegment,
} from './rlPiecewiseSolution.js';

/** The most angles one call of {@link rlCurrentAt} evaluates. */
export const MAX_CURRENT_ANGLES = 1_000_000;

/**
 * The exact periodic steady-state load current (amperes) at the given angles, for the same load
 * as {@link rlSteadyState} (standard circuit analysis: exponentials per segment with the
 * periodic initial condition, plus the back-EMF's sinusoidal steady state).
 *
 * At an edge the value on the segment that starts there is returned (the current is continuous
 * when l > 0, so this only matters for a resistive load).
 *
 * @param waveform - one period of the source voltage, volts
 * @param angles - radians, any finite values (wrapped into [0, 2π)), at most 1 000 000
 * @param options - the load, as for {@link rlSteadyState}
 * @returns one current per angle, amperes, in the order given
 * @throws ParameterRangeError naming the field for invalid input, and naming the input to
 *   blame when valid but extreme values would make a current non-finite (as rlSteadyState)
 */
export function rlCurrentAt(
  waveform: Waveform,
  angles: readonly number[],
  options: RlLoadOptions,
): number[] {
  assertWaveform(waveform);
  assertFiniteArray('angles', angles, 0, MAX_CURRENT_ANGLES);
  assertRlLoad(options);
  const solution = rlPiecewiseSolution(waveform, options);
  const { segments } = solution;
  const currents = new Array<number>(angles.length);
  // Angles often come in ascending order (a grid): then the segment is found by walking on
  // from the last one; any angle below the last is found by binary search.
  let index = 0;
  let previous = Infinity;
  for (let i = 0; i < angles.length; i++) {
    const theta = wrapAngle(angles[i] as number);
    if (theta >= previous)
      while (index + 1 < segments.length && (segments[index + 1] as RlSegment).start <= theta)
        index++;
    else index = segmentIndexAt(solution, theta);
    previous = theta;
    const current = currentInSegment(solution, segments[index] as RlSegment, theta);
    if (!Number.isFinite(current))
      throw nonFiniteLoadError(waveform, options, `the current at angles[${i}]`);
    currents[i] = current;
  }
  return currents;
}
