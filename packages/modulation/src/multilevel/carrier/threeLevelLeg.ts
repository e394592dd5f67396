import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';
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
 * - `t-type`: the same four gate signals. S2/S3 is the bidirectional pair from the output to the
 *   midpoint (two switches in anti-series); S2 stays on at the top level and S3 at the bottom,
 *   where each blocks nothing, so that every commutation is between one complementary pair
 *   (S1/S3 or S2/S4) with its dead time, as in NPC (M. Schweizer and J. W. Kolar, IEEE Trans.
 *   Power Electron., 2013; common practice, from memory). At the middle level both are on.
 */
export function threeLevelLeg(
  name: string,
  reference: ReferenceSignal,
  arrangement: Exclude<MultilevelCarrierArrangement, 'phase-shifted'>,
  vdc: number,
  compare: CarrierComparator,
): MultilevelLeg {
  const states = levelShiftedStates(reference, arrangement, 2, compare);
  const [lower, upper] = states as [(typeof states)[number], (typeof states)[number]];
  const output = countStates(states, vdc / 2, -vdc / 2);
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
