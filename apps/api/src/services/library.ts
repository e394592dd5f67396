import { HttpError } from '../http/errors.js';

/**
 * Calls the modulation library and turns its input errors (ParameterRangeError,
 * ParameterTypeError, any RangeError) into a 400 whose path is the API field: the library
 * names `ma`, the request names `modulation.ma`, so `prefix` is prepended to path and message.
 */
export function callLibrary<T>(prefix: string, work: () => T): T {
  try {
    return work();
  } catch (error) {
    throw asBadRequest(prefix, error);
  }
}

export function asBadRequest(prefix: string, error: unknown): unknown {
  if (!(error instanceof RangeError || error instanceof TypeError)) return error;
  const field = (error as { field?: unknown }).field;
  if (typeof field === 'string') {
    const path = `${prefix}${field}`;
    const message = error.message.startsWith(field) ? `${path}${error.message.slice(field.length)}` : error.message;
    return new HttpError(400, message, [{ path, message }]);
  }
  // Only the library's own checks raise these here; a TypeError from a bug has no field but
  // the library always names one, so a field-less TypeError stays a 500.
  if (error instanceof RangeError) return new HttpError(400, error.message, [{ path: prefix.replace(/\.$/, ''), message: error.message }]);
  return error;
}
