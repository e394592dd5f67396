import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterTypeError } from '../validation/errors.js';
import type { RlLoadOptions } from './RlLoad.js';

/**
 * Asserts that `options` is a valid {@link RlLoadOptions}: `r` > 0 Ω, `l` ≥ 0 H,
 * `frequency` > 0 Hz, and, when given, `emf.amplitude` ≥ 0 V and a finite `emf.phase` (rad).
 * @throws ParameterTypeError or ParameterRangeError naming the field and its range
 */
export function assertRlLoad(options: unknown): asserts options is RlLoadOptions {
  if (typeof options !== 'object' || options === null) {
    throw new ParameterTypeError('options', 'an object { r, l, frequency, emf? }', options);
  }
  const { r, l, frequency, emf } = options as Partial<RlLoadOptions>;
  assertNumberInRange('r', r, { min: 0, minExclusive: true });
  assertNumberInRange('l', l, { min: 0 });
  assertNumberInRange('frequency', frequency, { min: 0, minExclusive: true });
  if (emf === undefined) return;
  if (typeof emf !== 'object' || emf === null) {
    throw new ParameterTypeError('emf', 'an object { amplitude, phase }', emf);
  }
  assertNumberInRange('emf.amplitude', emf.amplitude, { min: 0 });
  assertNumberInRange('emf.phase', emf.phase);
}
