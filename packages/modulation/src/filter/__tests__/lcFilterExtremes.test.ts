import { describe, expect, it } from 'vitest';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { lcFilter, lcFilterResponse } from '../index.js';

/**
 * Valid but extreme filters must give a ParameterRangeError naming the field, never NaN or ∞
 * (defect F5 in docs/robustness.md). 2.5e-323 is a subnormal double and 2.5e-323 · 1e-110
 * underflows to 0 (IEEE 754-2019 binary64: smallest subnormal 4.9e-324, smallest normal 2.2e-308).
 */
describe('LC filter at the edges of double precision', () => {
  it('names c when l·c underflows (the fuzzer’s c 2.5e-323 F, l 1e-110 H)', () => {
    expect(rangeErrorField(() => lcFilter({ l: 1e-110, c: 2.5e-323 }))).toBe('c');
    expect(
      rangeErrorField(() => lcFilterResponse([50], { l: 1e-110, c: 2.5e-323, rDamping: 1 })),
    ).toBe('c');
  });

  it('names l when l/c overflows', () => {
    expect(rangeErrorField(() => lcFilter({ l: 1e300, c: 1e-10, rDamping: 1 }))).toBe('l');
  });

  it('names the frequency where an undamped, unloaded filter has infinite gain (exact resonance)', () => {
    // H = 1/(1 − ω²LC) is infinite at ω²LC = 1 (standard LC divider); l = c = 1/(2π) puts it at 1 Hz.
    const k = 1 / (2 * Math.PI);
    expect(rangeErrorField(() => lcFilterResponse([0, 1], { l: k, c: k }))).toBe('frequencies[1]');
  });

  it('keeps every figure finite or null over the documented ranges', () => {
    const result = lcFilter({
      l: 1e-9,
      c: 1e-12,
      rDamping: 1e6,
      dampingPlacement: 'parallel-with-inductor',
      loadR: 1e-3,
    });
    for (const value of Object.values(result))
      expect(value === null || Number.isFinite(value)).toBe(true);
  });
});
