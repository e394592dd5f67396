/**
 * The order n/q of a span's component as a fraction in lowest terms, for charts and tables:
 * `2`, `1/3`, `47/3` (Euclid's algorithm for the common divisor).
 * Internal: shared by subharmonicSpectrum and the design report's span labels.
 * @param n - the span order, an integer ≥ 0
 * @param q - the fundamental periods in the span, an integer ≥ 1
 */
export function fractionLabel(n: number, q: number): string {
  let [a, b] = [n, q];
  while (b !== 0) [a, b] = [b, a % b];
  const divisor = Math.max(1, a);
  return q / divisor === 1 ? String(n / divisor) : `${n / divisor}/${q / divisor}`;
}
