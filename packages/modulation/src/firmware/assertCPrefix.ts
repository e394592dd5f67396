import { ParameterRangeError } from '../validation/errors.js';

/** Longest prefix accepted: C99 guarantees 63 significant characters of an internal identifier
 * (ISO/IEC 9899:1999 §5.2.4.1), which leaves room for the longest suffix a writer appends. */
const MAX_PREFIX_LENGTH = 40;

/**
 * Asserts that `value` can prefix every name a C header writer emits (the timer table's and the
 * angle table's): a C identifier of 1 to 40 characters, letters, digits and `_`, not starting
 * with a digit (ISO/IEC 9899:1999 §6.4.2.1). Internal to the writers; one check for both.
 *
 * @throws ParameterRangeError naming `field` and the allowed form
 */
export function assertCPrefix(field: string, value: unknown): asserts value is string {
  const identifier = new RegExp(`^[A-Za-z_][A-Za-z0-9_]{0,${MAX_PREFIX_LENGTH - 1}}$`);
  if (typeof value !== 'string' || !identifier.test(value)) {
    throw new ParameterRangeError(
      field,
      `a C identifier of 1 to ${MAX_PREFIX_LENGTH} characters (letters, digits, _; not starting with a digit)`,
      value,
    );
  }
}
