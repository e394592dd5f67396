import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { MultilevelCarrierArrangement, MultilevelLeg } from '../MultilevelTypes.js';
import type { CarrierComparator } from './CarrierComparator.js';
import { complementState } from './complementState.js';
import { countStates } from './countStates.js';
import { levelShiftedStates } from './levelShiftedStates.js';

/**
 * One three-level leg (`npc` or `t-type`) under level-shifted carriers: output −vdc/2, 0 or
 * +vdc/2 to the DC midpoint by the count of the two bands the reference is above.
 *
 * Gate signals, upper band state u (1: top level) and lower band state l (1: not bottom):
 * - `npc` (Nabae, Takahashi and Akagi, 1981): S1 = u (on at the top level), S2 = l (top and
 *   middle), S3 = 1 − u (middle and bottom), S4 = 1 − l (bottom); S1/S3 and S2/S4 complementary.
 * - `t-type`: S1 = u (top), S2 = S3 = l·(1 − u) (the middle bidirectional pair, both on at the
 *   middle level), S4 = 1 − l (bottom).
 */
export function threeLevelLeg(
  name: string,
  topology: 'npc' | 't-type',
  reference: ReferenceSignal,
  arrangement: Exclude<MultilevelCarrierArrangement, 'phase-shifted'>,
  vdc: number,
  compare: CarrierComparator,
): MultilevelLeg {
  const states = levelShiftedStates(reference, arrangement, 2, compare);
  const [lower, upper] = states as [(typeof states)[number], (typeof states)[number]];
  const output = countStates(states, vdc / 2, -vdc / 2);
  if (topology === 'npc') {
    return {
      name,
      output,
      switches: [
        { name: 'S1', on: upper },
        { name: 'S2', on: lower },
        { name: 'S3', on: complementState(upper) },
        { name: 'S4', on: complementState(lower) },
      ],
      cells: [],
    };
  }
  const middle = combineWaveforms([lower, upper], ([l = 0, u = 0]) => l * (1 - u));
  return {
    name,
    output,
    switches: [
      { name: 'S1', on: upper },
      { name: 'S2', on: middle },
      { name: 'S3', on: middle },
      { name: 'S4', on: complementState(lower) },
    ],
    cells: [],
  };
}
