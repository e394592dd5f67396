import type { Harmonic } from './Harmonic.js';

/**
 * The order-0 entry of a spectrum for a mean value (volts or amperes): the amplitude is the
 * mean's magnitude and the phase carries its sign (0 for a mean ≥ 0, π below), so an amplitude
 * is never negative and the mean is `amplitude·cos(phase)`, the real part of the phasor
 * amplitude·e^{j·phase} that every other order uses. Internal to the library's spectra.
 */
export function meanHarmonic(mean: number): Harmonic {
  return { order: 0, amplitude: Math.abs(mean), phase: mean < 0 ? Math.PI : 0 };
}
