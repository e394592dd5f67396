import { assertNumberInRange } from '../validation/assertions.js';

/** A fraction p/q in lowest terms, q ≥ 1. */
export interface Fraction {
  /** Numerator p. */
  p: number;
  /** Denominator q, ≥ 1. */
  q: number;
}

/**
 * Relative distance below which a convergent counts as equal to x, so a decimal input such as
 * 7.2 gives 36/5 rather than a continued fraction spoiled by the rounding of 0.2 (the same
 * tolerance as the library's other whole-ratio tests).
 */
const EXACT_TOLERANCE = 1e-9;

/**
 * The fraction p/q nearest to x among all fractions with 1 ≤ q ≤ maxDenominator: the last
 * convergent of x's continued fraction whose denominator fits, or the best semiconvergent
 * beyond it, whichever is nearer (a fact of number theory: every best rational approximation
 * is a convergent or a semiconvergent; A. Ya. Khinchin, *Continued Fractions*, 1935, §6; G. H.
 * Hardy and E. M. Wright, *An Introduction to the Theory of Numbers*, ch. 10). The expansion
 * stops at a convergent within 1e−9 relative of x, which is then returned as x exactly.
 *
 * @param x - a finite number > 0
 * @param maxDenominator - the largest q allowed, an integer in [1, 1e6]
 * @throws ParameterRangeError naming `x` or `maxDenominator`
 */
export function bestRationalApproximation(x: number, maxDenominator: number): Fraction {
  assertNumberInRange('x', x, { min: 0, minExclusive: true, max: 1e15 });
  assertNumberInRange('maxDenominator', maxDenominator, { min: 1, max: 1e6, integer: true });
  // Convergents h/k: (previous, current), seeded with 0/1 and 1/0.
  let [p0, q0, p1, q1] = [0, 1, 1, 0];
  let rest = x;
  for (;;) {
    const term = Math.floor(rest);
    const q2 = q0 + term * q1;
    if (q2 > maxDenominator) {
      // Semiconvergents (p0 + j·p1)/(q0 + j·q1), j < term: the largest j that fits is the
      // nearest of them; it beats p1/q1 only when it is nearer to x.
      const j = Math.floor((maxDenominator - q0) / q1);
      const semi = { p: p0 + j * p1, q: q0 + j * q1 };
      const current = { p: p1, q: q1 };
      return Math.abs(semi.p / semi.q - x) < Math.abs(current.p / current.q - x) ? semi : current;
    }
    [p0, q0, p1, q1] = [p1, q1, p0 + term * p1, q2];
    const fraction = rest - term;
    if (Math.abs(p1 / q1 - x) <= EXACT_TOLERANCE * x || fraction === 0) return { p: p1, q: q1 };
    rest = 1 / fraction;
  }
}
