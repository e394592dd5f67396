/** A result as JSON text, two-space indented, with a final line break (NaN and ±∞ become null, as in JSON.stringify). */
export function toJson(value: unknown): string {
  return `${JSON.stringify(value, null, 2)}\n`;
}
