/** A complex number as a plain pair (real and imaginary parts). */
export interface Complex {
  re: number;
  im: number;
}

/** a + b. */
export function complexAdd(a: Complex, b: Complex): Complex {
  return { re: a.re + b.re, im: a.im + b.im };
}

/** a − b. */
export function complexSubtract(a: Complex, b: Complex): Complex {
  return { re: a.re - b.re, im: a.im - b.im };
}

/** a·b. */
export function complexMultiply(a: Complex, b: Complex): Complex {
  return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}

/** a/b (b ≠ 0). */
export function complexDivide(a: Complex, b: Complex): Complex {
  const scale = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / scale, im: (a.im * b.re - a.re * b.im) / scale };
}

/** |a|. */
export function complexAbs(a: Complex): number {
  return Math.hypot(a.re, a.im);
}

/**
 * The phasor of amplitude·sin(nθ + phase) in the library's harmonic convention: amplitude·e^{j·phase}.
 * A linear network multiplies it by its complex gain at the harmonic's frequency.
 */
export function phasorOf(amplitude: number, phase: number): Complex {
  return { re: amplitude * Math.cos(phase), im: amplitude * Math.sin(phase) };
}
