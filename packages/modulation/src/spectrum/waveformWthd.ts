import { assertWaveform } from '../waveform/assertWaveform.js';
import type { Waveform } from '../waveform/Waveform.js';
import { fundamentalAmplitude } from './fundamentalAmplitude.js';
import { waveformWthdOfFundamental } from './wholeWaveformDistortion.js';

/**
 * Weighted total harmonic distortion of a whole waveform, every order ≥ 2 included, exact:
 * WTHD = √(Σ_{n≥2} (V_n/n)²)/V₁ (Holmes and Lipo, 2003, ch. 3). The weights 1/n are the
 * harmonics of the waveform's running integral: for v − V₀ = Σ V_n·sin(nθ + φ_n) the integral
 * is Φ(θ) = C − Σ (V_n/n)·cos(nθ + φ_n), piecewise linear between the switching angles, so by
 * Parseval Σ_{n≥1} (V_n/n)²/2 is the variance of Φ over the period, integrated exactly segment by
 * segment. A ratio; unlike {@link wthd} of a truncated spectrum, nothing above any order is lost.
 *
 * @param waveform - one period, volts
 * @throws ParameterRangeError when the fundamental is zero
 */
export function waveformWthd(waveform: Waveform): number {
  assertWaveform(waveform);
  return waveformWthdOfFundamental(waveform, fundamentalAmplitude(waveform));
}
