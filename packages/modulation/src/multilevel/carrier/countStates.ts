import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';

/**
 * offset + step·(the number of 0/1 states at 1): a leg's output voltage from its comparator
 * states (volts when `step` and `offset` are).
 */
export function countStates(states: readonly Waveform[], step: number, offset: number): Waveform {
  return combineWaveforms(states, (values) => offset + step * values.reduce((s, v) => s + v, 0));
}
