import { ParameterRangeError, ParameterTypeError, type Harmonic } from '@pulsewright/modulation';
import { HttpError } from '../http/errors.js';

/**
 * Calls the modulation library and turns its input errors (ParameterRangeError,
 * ParameterTypeError: those that name a `field`) into a 400 whose path is the API field: the
 * library names `ma`, the request names `modulation.ma`, so `prefix` is prepended to path and
 * message, except for the `unprefixed` fields, which sit at the top of the request (e.g.
 * `maxOrder`). Any other error (a bare RangeError such as V8's "Invalid array length") is a bug
 * and passes through unchanged, to become a 500.
 */
export function callLibrary<T>(
  prefix: string,
  work: () => T,
  unprefixed: readonly string[] = [],
): T {
  try {
    return work();
  } catch (error) {
    throw asBadRequest(prefix, error, unprefixed);
  }
}

export function asBadRequest(
  prefix: string,
  error: unknown,
  unprefixed: readonly string[] = [],
): unknown {
  if (!(error instanceof ParameterRangeError || error instanceof ParameterTypeError)) return error;
  const field = error.field;
  const path = unprefixed.includes(field) ? field : `${prefix}${field}`;
  const message = error.message.startsWith(field)
    ? `${path}${error.message.slice(field.length)}`
    : error.message;
  return new HttpError(400, message, [{ path, message }]);
}

/**
 * Whether every number in `value` (own enumerable properties and array elements, to the depth
 * firstNonFinite looks) is finite; builds no strings and allocates nothing. A number is tested
 * where it is read (`x - x` is 0 for a finite x and NaN for NaN and ±∞), so a leaf costs no call;
 * `Object.hasOwn` is asked only of what would change the answer (a non-finite number, an object
 * to descend into), not of every key. A spectrum's 1051 harmonics take about 16 µs here, against
 * 45 µs for a walk that called itself per number (docs/robustness.md, throughput).
 */
function allFinite(value: object, depth = 0): boolean {
  if (depth > 8) return true;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const entry: unknown = value[i];
      if (typeof entry === 'number') {
        if (entry - entry !== 0) return false;
      } else if (typeof entry === 'object' && entry !== null && !allFinite(entry, depth + 1))
        return false;
    }
    return true;
  }
  for (const key in value) {
    const entry: unknown = (value as Record<string, unknown>)[key];
    if (typeof entry === 'number') {
      if (entry - entry !== 0 && Object.hasOwn(value, key)) return false;
    } else if (
      typeof entry === 'object' &&
      entry !== null &&
      Object.hasOwn(value, key) &&
      !allFinite(entry, depth + 1)
    )
      return false;
  }
  return true;
}

/** The JSON path of the first number in `value` that is NaN or ±∞, or undefined when all are finite. */
function firstNonFinite(value: unknown, at: string, depth = 0): string | undefined {
  if (typeof value === 'number') return Number.isFinite(value) ? undefined : at;
  if (depth > 8 || value === null || typeof value !== 'object') return undefined;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = firstNonFinite(value[i], `${at}[${i}]`, depth + 1);
      if (found) return found;
    }
    return undefined;
  }
  for (const [key, entry] of Object.entries(value)) {
    const found = firstNonFinite(entry, at ? `${at}.${key}` : key, depth + 1);
    if (found) return found;
  }
  return undefined;
}

/**
 * {@link finiteResult} for a spectrum answer, whose harmonics are the library's `Harmonic`
 * objects (order, amplitude, phase): each harmonic's three numbers are read by name, which the
 * compiled loop reads unboxed, and the rest of the answer is walked as finiteResult walks it.
 * The generic walk reads every number by key, boxing each one: 16 µs and 50 kB of garbage for
 * the 1051 harmonics of `POST /spectra` at maxOrder 1050, about 2 % of that request's
 * instructions (docs/robustness.md, throughput, fifth pass). The same answers and refusals.
 */
export function finiteSpectrum<T extends { harmonics: readonly Harmonic[] }>(
  field: string,
  result: T,
): T {
  const { harmonics, ...rest } = result;
  for (let i = 0; i < harmonics.length; i++) {
    const { order, amplitude, phase } = harmonics[i]!;
    if (order - order !== 0 || amplitude - amplitude !== 0 || phase - phase !== 0)
      return finiteResult(field, result);
  }
  finiteResult(field, rest);
  return result;
}

/**
 * The last guard before the response validator: a library result holding NaN or ±∞ (which
 * JSON would send as null and the contract forbids) becomes a 400 naming the input `field`
 * whose values are too extreme, never a 500.
 */
export function finiteResult<T>(field: string, result: T): T {
  // The common case (all finite) is checked without building a path for every element.
  if (
    typeof result === 'number'
      ? result - result === 0
      : typeof result !== 'object' || result === null || allFinite(result)
  )
    return result;
  const where = firstNonFinite(result, '') as string;
  const message = `${field} holds values so extreme that ${where} is not a finite number in double precision; use values nearer the documented working range`;
  throw new HttpError(400, message, [{ path: field, message }]);
}
