/* Internal to the C header writers (not exported by the package): text that C accepts. */

/**
 * A number with 12 significant digits and no trailing zeros: drops binary rounding such as
 * 5.000000000000001e-7 while keeping every digit a timer or table parameter needs.
 */
export function clean(value: number): string {
  return String(Number(value.toPrecision(12)));
}

/** A time in seconds written in nanoseconds, the unit dead times are specified in. */
export function nanoseconds(seconds: number): string {
  return `${clean(seconds * 1e9)} ns`;
}

/** Text safe inside a C block comment: no comment terminator, printable ASCII only. */
export function commentSafe(text: string): string {
  return text.replace(/\*\//g, '* /').replace(/[^\x20-\x7e]/g, (ch) => ASCII_FOR[ch] ?? '?');
}

const ASCII_FOR: Record<string, string> = {
  θ: 'theta',
  π: 'pi',
  '−': '-',
  '±': '+/-',
  '·': '*',
  '≥': '>=',
  '≤': '<=',
  Δ: 'delta',
};

/**
 * A C array definition `declaration = { … };` of whole numbers, ten a line, each with `suffix`
 * (`u`, `UL`), and a blank line after it.
 */
export function cArrayLines(
  declaration: string,
  values: readonly number[],
  suffix: string,
): string[] {
  const lines = [`${declaration} = {`];
  for (let i = 0; i < values.length; i += 10) {
    lines.push(
      `  ${values
        .slice(i, i + 10)
        .map((v) => `${Math.round(v)}${suffix}`)
        .join(', ')},`,
    );
  }
  lines.push('};', '');
  return lines;
}
