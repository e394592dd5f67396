import { ParameterRangeError } from '../validation/errors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { harmonics } from './harmonics.js';

/**
 * The fundamental's amplitude (peak volts) of a validated waveform.
 * @throws ParameterRangeError naming `waveform` when it is zero (no distortion ratio exists)
 */
export function fundamentalAmplitude(waveform: Waveform): number {
  const amplitude = harmonics(waveform, 1)[1]?.amplitude ?? 0;
  if (!(amplitude > 0)) {
    throw new ParameterRangeError(
      'waveform',
      'a waveform whose fundamental (order 1) has an amplitude > 0',
      amplitude,
    );
  }
  return amplitude;
}
