// Types for the `bessel` package (pure-JS reference implementation, test-only dependency).
declare module 'bessel' {
  /** Bessel function of the first kind J_n(x). */
  export function besselj(x: number, n: number): number;
}
