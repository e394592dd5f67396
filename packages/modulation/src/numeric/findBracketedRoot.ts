/**
 * Brent's method: a root of `f` in [a, b] given f(a) and f(b) of opposite signs (R. P. Brent,
 * *Algorithms for Minimization without Derivatives*, 1973, ch. 4). Converges to machine
 * precision: the returned x brackets the sign change within 4·ε·|x| + 1e-300.
 *
 * @param f - continuous on [a, b], or with a jump: the jump's position is returned then
 * @returns x with f(x) = 0 or at the sign change
 */
export function findBracketedRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  fa = f(a),
  fb = f(b),
): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa > 0 === fb > 0)
    throw new RangeError('findBracketedRoot: f(a) and f(b) must differ in sign');
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < 200; iteration++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tolerance = 2 * Number.EPSILON * Math.abs(b) + 1e-300;
    const half = (c - b) / 2;
    if (Math.abs(half) <= tolerance || fb === 0) return b;
    if (Math.abs(e) >= tolerance && Math.abs(fa) > Math.abs(fb)) {
      // Inverse quadratic interpolation, or the secant step when only two points differ.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * half * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * half * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * half * q - Math.abs(tolerance * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = half;
        e = d;
      }
    } else {
      d = half;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tolerance ? d : half > 0 ? tolerance : -tolerance;
    fb = f(b);
  }
  return b;
}
