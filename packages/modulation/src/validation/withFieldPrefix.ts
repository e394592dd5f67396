import { ParameterRangeError, ParameterTypeError } from './errors.js';

/**
 * Runs `work` and re-throws its ParameterRangeError / ParameterTypeError with `prefix` before the
 * field, so an error from a function that names `ma` reads `modulation.ma` to the caller who
 * passed a whole design. Other errors pass through unchanged.
 */
export function withFieldPrefix<T>(prefix: string, work: () => T): T {
  try {
    return work();
  } catch (error) {
    if (error instanceof ParameterRangeError)
      throw new ParameterRangeError(prefix + error.field, error.allowed, error.value);
    if (error instanceof ParameterTypeError)
      throw new ParameterTypeError(prefix + error.field, error.expected, error.value);
    throw error;
  }
}
