import { assertWaveform } from '../waveform/assertWaveform.js';
import type { Waveform } from '../waveform/Waveform.js';
import { fundamentalAmplitude } from './fundamentalAmplitude.js';
import { waveformThdOfFundamental } from './wholeWaveformDistortion.js';

/**
 * Total harmonic distortion of a whole waveform, every order ≥ 2 included, exact: by Parseval's
 * theorem the harmonics above the fundamental hold the mean square left after the mean and the
 * fundamental, Σ_{n≥2} V_n²/2 = ⟨v²⟩ − V₀² − V₁²/2, so THD = √(2·that)/V₁ with ⟨v²⟩ from the
 * switching angles (standard Fourier analysis). A ratio (0.4834, not 48.34); a square wave gives
 * √(π²/8 − 1). Unlike {@link thd} of a truncated spectrum, nothing above any order is lost.
 *
 * @param waveform - one period, volts
 * @throws ParameterRangeError when the fundamental is zero
 */
export function waveformThd(waveform: Waveform): number {
  assertWaveform(waveform);
  return waveformThdOfFundamental(waveform, fundamentalAmplitude(waveform));
}
