import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';

/** 1 − state: the gate signal of the complementary switch of a 0/1 gate signal. */
export function complementState(state: Waveform): Waveform {
  return combineWaveforms([state], ([value = 0]) => 1 - value);
}
