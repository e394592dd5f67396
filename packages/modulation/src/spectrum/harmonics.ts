import type { Waveform } from '../waveform/Waveform.js';
import type { Harmonic } from './Harmonic.js';
import { harmonicPhasors } from './harmonicPhasors.js';
import { harmonicsOfPhasors } from './harmonicsOfPhasors.js';

export { MAX_HARMONIC_ORDER } from './harmonicPhasors.js';

/**
 * Exact Fourier series of a piecewise-constant waveform, orders 0..maxOrder.
 *
 * A piecewise-constant v(θ) has derivative Σ Δᵢ·δ(θ − θᵢ), where Δᵢ is the jump at edge θᵢ, so
 * its complex coefficients are c_n = Σ Δᵢ e^{−jnθᵢ} / (2πjn) for n ≥ 1 (standard Fourier
 * analysis of a step function). No sampling and no FFT: the only error is floating-point
 * rounding (about 1e−13 of the largest level). The sums are `harmonicPhasors`'.
 *
 * Convention: v(θ) = mean + Σ amplitude_n · sin(nθ + phase_n), θ in radians; the mean is
 * order 0's amplitude·cos(phase) (phase 0 or π: amplitudes are never negative).
 *
 * @param waveform - one period of the voltage (volts)
 * @param maxOrder - highest order, an integer in [0, 100000]
 * @returns maxOrder + 1 entries, index = order
 */
export function harmonics(waveform: Waveform, maxOrder: number): Harmonic[] {
  return harmonicsOfPhasors(harmonicPhasors(waveform, maxOrder));
}
