import type { Waveform } from '../waveform/Waveform.js';
import { harmonics } from './harmonics.js';
import { assertFundamental } from './wholeWaveformDistortion.js';

/**
 * The fundamental's amplitude (peak volts) of a validated waveform.
 * @throws ParameterRangeError naming `waveform` when it is zero (no distortion ratio exists)
 */
export function fundamentalAmplitude(waveform: Waveform): number {
  return assertFundamental(harmonics(waveform, 1)[1]?.amplitude ?? 0);
}
