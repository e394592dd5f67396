import type { Problem } from './problem.js';

/**
 * The library's ParameterRangeError / ParameterTypeError (recognised by name and `field`, as they
 * may come from another copy of the package): a 400 naming the field in the library's words.
 * A bare RangeError or TypeError is not one of these: it is a bug, and falls through to a 500.
 */
export function libraryProblem(err: unknown): Problem | undefined {
  if (
    !(err instanceof Error) ||
    (err.name !== 'ParameterRangeError' && err.name !== 'ParameterTypeError')
  )
    return undefined;
  const field = (err as { field?: unknown }).field;
  if (typeof field !== 'string') return undefined;
  return { status: 400, detail: err.message, errors: [{ path: field, message: err.message }] };
}
