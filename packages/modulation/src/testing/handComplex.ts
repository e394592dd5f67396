/**
 * Complex arithmetic written for the tests without the library's own complex numbers, so that
 * the hand-solved networks of the design tests (circuit theory: voltage dividers, mesh analysis)
 * do not share code with what they check. A number is `[real, imaginary]`.
 */
export type HandComplex = [number, number];

export const add = (a: HandComplex, b: HandComplex): HandComplex => [a[0] + b[0], a[1] + b[1]];

export const sub = (a: HandComplex, b: HandComplex): HandComplex => [a[0] - b[0], a[1] - b[1]];

export const mul = (a: HandComplex, b: HandComplex): HandComplex => [
  a[0] * b[0] - a[1] * b[1],
  a[0] * b[1] + a[1] * b[0],
];

export const div = (a: HandComplex, b: HandComplex): HandComplex => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

export const abs = (a: HandComplex): number => Math.hypot(a[0], a[1]);

/** The phasor of A·sin(θ + φ) in the `harmonics` convention: A·e^{jφ}. */
export const polar = (amplitude: number, phase: number): HandComplex => [
  amplitude * Math.cos(phase),
  amplitude * Math.sin(phase),
];
