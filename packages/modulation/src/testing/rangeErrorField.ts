import { expect } from 'vitest';
import { ParameterRangeError } from '../validation/errors.js';

/**
 * Runs `run` and returns the `field` of the ParameterRangeError it throws (asserting that it is
 * one), or undefined when it does not throw. Test-only helper (excluded from the build).
 */
export function rangeErrorField(run: () => unknown): string | undefined {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(ParameterRangeError);
    return (error as ParameterRangeError).field;
  }
  return undefined;
}
