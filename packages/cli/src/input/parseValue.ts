/**
 * A command-line value as a number when it reads as one (`400`, `1e-6`, `-0.5`), otherwise the
 * text itself, so the library's check can say `must be a number; got "abc"` in its own words.
 */
export function parseNumber(text: string): number | string {
  const trimmed = text.trim();
  if (trimmed === '') return text;
  const value = Number(trimmed);
  return Number.isNaN(value) ? text : value;
}

/** A comma-separated list of numbers (`5,7,11,13`), each read by {@link parseNumber}. */
export function parseNumberList(text: string): (number | string)[] {
  return text.trim() === '' ? [] : text.split(',').map(parseNumber);
}

/** A `--set` value: JSON when it parses (`0.8`, `null`, `[1,2]`, `{"r":4}`), otherwise the text. */
export function parseSetValue(text: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return text;
  }
}
