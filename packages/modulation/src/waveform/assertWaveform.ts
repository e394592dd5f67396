import { TAU } from '../math.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertFiniteArray } from '../validation/assertions.js';
import type { Waveform } from './Waveform.js';

/** The most edges a waveform may hold; bounds the cost of every function that takes one. */
export const MAX_WAVEFORM_EDGES = 1_000_000;

/**
 * Asserts that `value` is a valid {@link Waveform}: edges finite, strictly ascending, in
 * [0, 2π); as many levels as edges, all finite.
 * @param field - the name used in error messages, `waveform` by default
 * @throws ParameterTypeError or ParameterRangeError naming the offending entry
 */
export function assertWaveform(value: unknown, field = 'waveform'): asserts value is Waveform {
  if (typeof value !== 'object' || value === null) {
    throw new ParameterTypeError(field, 'an object { edges, levels }', value);
  }
  const { edges, levels } = value as Partial<Waveform>;
  assertFiniteArray(`${field}.edges`, edges, 1, MAX_WAVEFORM_EDGES);
  assertFiniteArray(`${field}.levels`, levels, edges.length, edges.length);
  for (let i = 0; i < edges.length; i++) {
    const edge = edges[i] as number;
    if (edge < 0 || edge >= TAU) {
      throw new ParameterRangeError(`${field}.edges[${i}]`, 'an angle in [0, 2π) radians', edge);
    }
    if (i > 0 && edge <= (edges[i - 1] as number)) {
      throw new ParameterRangeError(
        `${field}.edges[${i}]`,
        `strictly greater than edges[${i - 1}] = ${edges[i - 1]}`,
        edge,
      );
    }
  }
}
