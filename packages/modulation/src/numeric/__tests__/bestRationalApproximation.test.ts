import { describe, expect, it } from 'vitest';
import { bestRationalApproximation } from '../bestRationalApproximation.js';
import { mulberry32 } from '../mulberry32.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';

/** The nearest p/q with q ≤ maxDenominator by trying every q (the definition, no continued fraction). */
function bruteForce(x: number, maxDenominator: number): { distance: number } {
  let distance = Infinity;
  for (let q = 1; q <= maxDenominator; q++) {
    distance = Math.min(distance, Math.abs(Math.round(x * q) / q - x));
  }
  return { distance };
}

describe('bestRationalApproximation', () => {
  it('gives the classical approximations of π (fact of number theory: 22/7, 333/106, 355/113)', () => {
    expect(bestRationalApproximation(Math.PI, 7)).toEqual({ p: 22, q: 7 });
    expect(bestRationalApproximation(Math.PI, 106)).toEqual({ p: 333, q: 106 });
    expect(bestRationalApproximation(Math.PI, 1000)).toEqual({ p: 355, q: 113 });
  });

  it('finds a semiconvergent when it is nearer than the last convergent (√2, q ≤ 4: 4/3)', () => {
    // Convergents of √2: 1, 3/2, 7/5, 17/12. With q ≤ 4 the candidates are 3/2 (0.0858 away)
    // and the semiconvergent 4/3 (0.0809 away): 4/3 is nearer (hand-worked).
    expect(bestRationalApproximation(Math.SQRT2, 4)).toEqual({ p: 4, q: 3 });
    expect(bestRationalApproximation(Math.SQRT2, 5)).toEqual({ p: 7, q: 5 });
  });

  it('returns a decimal input that is exactly p/q as p/q (7.2 = 36/5; 5000/48 = 625/6)', () => {
    expect(bestRationalApproximation(7.2, 64)).toEqual({ p: 36, q: 5 });
    expect(bestRationalApproximation(5000 / 48, 64)).toEqual({ p: 625, q: 6 });
    expect(bestRationalApproximation(21, 64)).toEqual({ p: 21, q: 1 });
  });

  it('is as near as the nearest fraction found by trying every denominator (500 random cases)', () => {
    const random = mulberry32(12);
    for (let k = 0; k < 500; k++) {
      const x = 1 + 200 * random();
      const maxDenominator = 1 + Math.floor(100 * random());
      const { p, q } = bestRationalApproximation(x, maxDenominator);
      expect(q).toBeLessThanOrEqual(maxDenominator);
      // Equal distances to rounding: the search and the brute force may pick either of a tie.
      expect(Math.abs(p / q - x)).toBeLessThanOrEqual(
        bruteForce(x, maxDenominator).distance + 1e-12,
      );
    }
  });

  it('names the field of a bad input', () => {
    expect(rangeErrorField(() => bestRationalApproximation(0, 10))).toBe('x');
    expect(rangeErrorField(() => bestRationalApproximation(Number.NaN, 10))).toBe('x');
    expect(rangeErrorField(() => bestRationalApproximation(2.5, 0))).toBe('maxDenominator');
    expect(rangeErrorField(() => bestRationalApproximation(2.5, 1.5))).toBe('maxDenominator');
  });
});
