/** Exit status of a run: 0 done, 1 failure (the work could not be done), 2 bad input. */
export const EXIT_OK = 0;
export const EXIT_FAILURE = 1;
export const EXIT_BAD_INPUT = 2;

/**
 * Bad input found by the command line itself (an unreadable or unparsable file, a value that is
 * not a number, a method the command does not take). `field` names what to fix, as the
 * library's errors do.
 */
export class InputError extends Error {
  override readonly name = 'InputError';

  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
  }
}

/** The work ran but did not reach its goal (a solver found no solution): exit status 1. */
export class FailureError extends Error {
  override readonly name = 'FailureError';
}

/** A library error that names the field it refuses (ParameterRangeError, ParameterTypeError). */
export interface FieldError extends Error {
  field: string;
}

/** True for the library's input errors, which name their field. */
export function isFieldError(error: unknown): error is FieldError {
  return (
    (error instanceof RangeError || error instanceof TypeError) &&
    typeof (error as { field?: unknown }).field === 'string'
  );
}

/**
 * The exit status for an error: 2 for bad input (the command line's own InputError, the
 * library's RangeError and field-naming TypeError), 1 for anything else. A TypeError without a
 * field is a defect, not the caller's input, so it stays 1.
 */
export function exitCodeOf(error: unknown): number {
  if (error instanceof InputError || error instanceof RangeError || isFieldError(error))
    return EXIT_BAD_INPUT;
  return EXIT_FAILURE;
}
