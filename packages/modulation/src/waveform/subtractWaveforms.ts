import type { Waveform } from './Waveform.js';
import { combineWaveforms } from './combineWaveforms.js';

/**
 * The difference `a − b` of two waveforms, exact; for example a line-to-line voltage from two
 * leg-to-midpoint voltages, or an H-bridge output from its two legs.
 */
export function subtractWaveforms(a: Waveform, b: Waveform): Waveform {
  return combineWaveforms([a, b], ([va, vb]) => (va as number) - (vb as number));
}
