import { ParameterRangeError, ParameterTypeError } from './errors.js';

/** Bounds of a numeric parameter; each bound is inclusive unless its `Exclusive` flag is set. */
export interface NumberBounds {
  min?: number;
  max?: number;
  minExclusive?: boolean;
  maxExclusive?: boolean;
  integer?: boolean;
}

/**
 * Asserts that `value` is a finite number within `bounds`.
 * @throws ParameterTypeError when `value` is not a number
 * @throws ParameterRangeError when it is NaN, infinite, not an integer where one is needed, or
 *   out of bounds; the message names `field` and the allowed range
 */
export function assertNumberInRange(
  field: string,
  value: unknown,
  bounds: NumberBounds = {},
): asserts value is number {
  if (typeof value !== 'number') throw new ParameterTypeError(field, 'a number', value);
  const { min, max } = bounds;
  const outside =
    !Number.isFinite(value) ||
    (bounds.integer === true && !Number.isInteger(value)) ||
    (min !== undefined && (bounds.minExclusive === true ? value <= min : value < min)) ||
    (max !== undefined && (bounds.maxExclusive === true ? value >= max : value > max));
  if (outside) throw new ParameterRangeError(field, describeBounds(bounds), value);
}

/**
 * Asserts that `value` is one of `choices`.
 * @throws ParameterRangeError naming `field` and listing the choices
 */
export function assertOneOf<T extends string>(
  field: string,
  value: unknown,
  choices: readonly T[],
): asserts value is T {
  if (typeof value !== 'string' || !(choices as readonly string[]).includes(value)) {
    throw new ParameterRangeError(
      field,
      `one of ${choices.map((c) => `'${c}'`).join(', ')}`,
      value,
    );
  }
}

/**
 * Asserts that `value` is an array of finite numbers with a length in [minLength, maxLength].
 * @throws ParameterTypeError when it is not an array
 * @throws ParameterRangeError for a bad length or a non-finite entry (named `field[i]`)
 */
export function assertFiniteArray(
  field: string,
  value: unknown,
  minLength = 0,
  maxLength = Number.MAX_SAFE_INTEGER,
): asserts value is number[] {
  if (!Array.isArray(value) && !(value instanceof Float64Array)) {
    throw new ParameterTypeError(field, 'an array of numbers', value);
  }
  if (value.length < minLength || value.length > maxLength) {
    const allowed =
      maxLength === Number.MAX_SAFE_INTEGER
        ? `an array of at least ${minLength} numbers`
        : `an array of ${minLength} to ${maxLength} numbers`;
    throw new ParameterRangeError(`${field}.length`, allowed, value.length);
  }
  for (let i = 0; i < value.length; i++) {
    const entry: unknown = value[i];
    if (typeof entry !== 'number' || !Number.isFinite(entry)) {
      throw new ParameterRangeError(`${field}[${i}]`, 'a finite number', entry);
    }
  }
}

function describeBounds(bounds: NumberBounds): string {
  const kind = bounds.integer === true ? 'an integer' : 'a finite number';
  const parts: string[] = [];
  if (bounds.min !== undefined)
    parts.push(`${bounds.minExclusive === true ? '>' : '≥'} ${bounds.min}`);
  if (bounds.max !== undefined)
    parts.push(`${bounds.maxExclusive === true ? '<' : '≤'} ${bounds.max}`);
  return parts.length === 0 ? kind : `${kind} ${parts.join(' and ')}`;
}
