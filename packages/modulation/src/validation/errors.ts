/**
 * A parameter outside its allowed range. It is a `RangeError`, so callers that only know the
 * standard error kinds still catch it; `field` and `allowed` let a service name the field.
 */
export class ParameterRangeError extends RangeError {
  override readonly name = 'ParameterRangeError';

  /**
   * @param field - the option's name as the caller wrote it, for example `ma` or `load.r`
   * @param allowed - the allowed range in words, for example `a finite number > 0`
   * @param value - the value that was given
   */
  constructor(
    readonly field: string,
    readonly allowed: string,
    readonly value: unknown,
  ) {
    super(`${field} must be ${allowed}; got ${describeValue(value)}`);
  }
}

/** A parameter of the wrong kind (a string where a number is needed, a missing array). */
export class ParameterTypeError extends TypeError {
  override readonly name = 'ParameterTypeError';

  constructor(
    readonly field: string,
    readonly expected: string,
    readonly value: unknown,
  ) {
    super(`${field} must be ${expected}; got ${describeValue(value)}`);
  }
}

function describeValue(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  if (value === null) return 'null';
  return typeof value;
}
