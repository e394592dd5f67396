import { expect } from 'vitest';

/**
 * Asserts |actual − expected| ≤ delta, with a message that shows all three. Test-only helper
 * (excluded from the build, never exported by the package).
 */
export function assertInDelta(actual: number, expected: number, delta: number, label = ''): void {
  const error = Math.abs(actual - expected);
  expect(
    error <= delta,
    `${label} expected ${expected} ± ${delta}, got ${actual} (error ${error})`,
  ).toBe(true);
}
