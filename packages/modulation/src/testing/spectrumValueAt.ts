import type { Harmonic } from '../spectrum/Harmonic.js';

/**
 * A spectrum's Fourier sum at one angle, term by term in the `harmonics` convention (order 0's
 * amplitude·cos(phase) is the signed mean; order n ≥ 1 adds amplitude·sin(nθ + phase)): the
 * tests' direct evaluation of what a synthesis or a closed form should give there. Test-only
 * helper (excluded from the build, never exported by the package).
 * @param theta - radians of the fundamental
 */
export function spectrumValueAt(spectrum: readonly Harmonic[], theta: number): number {
  return spectrum.reduce(
    (sum, h) =>
      sum +
      (h.order === 0
        ? h.amplitude * Math.cos(h.phase)
        : h.amplitude * Math.sin(h.order * theta + h.phase)),
    0,
  );
}
