import { ParameterRangeError, ParameterTypeError } from '@pulsewright/modulation';

/** How the library's field names become the names the command-line user gave. */
export interface FieldNaming {
  /** Put before every field not listed in `keep` or `rename`, e.g. `design.`. @default '' */
  prefix?: string;
  /** Fields that keep their own name (options such as `maxOrder`). @default [] */
  keep?: readonly string[];
  /** Fields with a name of their own, e.g. `sampling` → `design.modulation.sampling`. @default {} */
  rename?: Readonly<Record<string, string>>;
  /** A note an error about a field ends with: which option set it, or which option can. */
  notes?: ReadonlyMap<string, string>;
}

/**
 * Runs `work` and re-throws the library's field errors (ParameterRangeError, ParameterTypeError)
 * with the field named as the user gave it, in the library's words: `modulation.ma must be …`
 * becomes `design.modulation.ma must be …; got 5 (from --ma)`. Other errors pass unchanged.
 */
export function callLibrary<T>(work: () => T, naming: FieldNaming = {}): T {
  try {
    return work();
  } catch (error) {
    throw renamed(error, naming);
  }
}

function renamed(error: unknown, naming: FieldNaming): unknown {
  if (!(error instanceof ParameterRangeError || error instanceof ParameterTypeError)) return error;
  const { prefix = '', keep = [], rename = {}, notes } = naming;
  const field =
    rename[error.field] ?? (keep.includes(error.field) ? error.field : prefix + error.field);
  const copy =
    error instanceof ParameterRangeError
      ? new ParameterRangeError(field, error.allowed, error.value)
      : new ParameterTypeError(field, error.expected, error.value);
  // An entry or the length of a list takes the list's note: eliminate[2] → eliminate.
  const note = notes?.get(field) ?? notes?.get(field.replace(/(\[\d+\]|\.length)+$/, ''));
  if (note !== undefined) copy.message = `${copy.message} (${note})`;
  return copy;
}
