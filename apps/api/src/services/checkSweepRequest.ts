import { ParameterRangeError, ParameterTypeError } from '@pulsewright/modulation';
import { asBadRequest } from './library.js';

/** The library's names of a sweep's fields and the request's (POST /api/v1/jobs/*-sweeps). */
const REQUEST_NAMES: readonly [library: string, request: string][] = [
  ['fundamentals', 'fundamental'],
  ['angles', 'initialAngles'],
];

function requestField(field: string): string {
  for (const [library, request] of REQUEST_NAMES) {
    if (field === library || field.startsWith(`${library}.`) || field.startsWith(`${library}[`)) {
      return `${request}${field.slice(library.length)}`;
    }
  }
  return field;
}

/**
 * Runs the library's check of a whole sweep request (assertSheSweepOptions,
 * assertOptimalPulseSweepOptions) before a job is reserved, so a range end past the pattern's
 * limit is a 400 up front naming the request's field (`fundamental.to`, not the library's
 * `fundamentals.to`), never a later chunk's failure.
 */
export function checkSweepRequest(check: () => void): void {
  try {
    check();
  } catch (error) {
    if (error instanceof ParameterRangeError) {
      throw asBadRequest(
        '',
        new ParameterRangeError(requestField(error.field), error.allowed, error.value),
      );
    }
    if (error instanceof ParameterTypeError) {
      throw asBadRequest(
        '',
        new ParameterTypeError(requestField(error.field), error.expected, error.value),
      );
    }
    throw error;
  }
}
