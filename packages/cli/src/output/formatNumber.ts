/**
 * A number for a table a person reads: six significant digits, no trailing zeros (`400`,
 * `0.0123457`, `1.23457e-7`); `—` for null, NaN or infinity.
 */
export function formatNumber(value: number | null | undefined, digits = 6): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return String(Number(value.toPrecision(digits)));
}

/** A ratio as a percentage for people: 0.012345 → `1.2345`. */
export function formatPercent(ratio: number | null | undefined, digits = 5): string {
  return ratio === null || ratio === undefined ? '—' : formatNumber(ratio * 100, digits);
}

/** Radians to degrees for people, 6 significant digits. */
export function formatDegrees(radians: number): string {
  return formatNumber((radians * 180) / Math.PI);
}

/** An angle in radians to four decimals (a phase for people; −0 shows as 0). */
export function formatRadians(radians: number): string {
  const text = radians.toFixed(4);
  return /^-0\.0+$/.test(text) ? text.slice(1) : text;
}
