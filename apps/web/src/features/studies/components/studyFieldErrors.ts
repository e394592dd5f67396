import { DESIGN_BOUNDS, type DesignBoundsField, type NumberBounds } from '@pulsewright/modulation';
import { fieldErrorOf } from '../../../lib/api';
import { rangeError, rangeText, type FieldUnit } from '../../../lib/fieldRange';
import type { PreviewFieldError } from '../model/designPreview';

/**
 * The study form's field messages: `error` gives a field's message by its design path(s), the
 * server's answer to a save first, then the library's preview refusal; `limits` gives a number
 * field's hint (its range in the unit it shows, the library's bounds) and message (what was
 * entered when the bounds refuse it, else the server's or the library's). Every preview refusal
 * asked for is recorded in `claimed`, so the form can list the ones no field shows.
 */
export function studyFieldErrors(saveError: unknown, previewErrors: readonly PreviewFieldError[]) {
  const claimed = new Set<string>();
  const matches = (field: string, path: string) =>
    field === path || field.startsWith(`${path}.`) || field.startsWith(`${path}[`);
  const error = (...paths: string[]) => {
    for (const e of previewErrors) if (paths.some((p) => matches(e.field, p))) claimed.add(e.field);
    return (
      paths.map((p) => fieldErrorOf(saveError, p)).find(Boolean) ??
      previewErrors.find((e) => paths.some((p) => matches(e.field, p)))?.message
    );
  };
  const limits = (
    path: DesignBoundsField,
    label: string,
    value: number,
    unit: FieldUnit = {},
    bounds: NumberBounds = DESIGN_BOUNDS[path],
  ) => {
    const fromLibrary = error(path);
    return {
      hint: rangeText(bounds, unit),
      error: rangeError(label, value, bounds, unit) ?? fromLibrary,
    };
  };
  return { error, limits, claimed: claimed as ReadonlySet<string> };
}

/** What `studyFieldErrors` returns, handed to each fieldset of the study form. */
export type StudyFieldErrors = ReturnType<typeof studyFieldErrors>;
