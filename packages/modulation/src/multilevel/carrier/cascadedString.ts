import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import type { MultilevelCarrierArrangement, MultilevelLeg } from '../MultilevelTypes.js';
import type { CarrierComparator } from './CarrierComparator.js';
import { complementState } from './complementState.js';
import { levelShiftedStates } from './levelShiftedStates.js';
import { negatedReference } from './negatedReference.js';

/**
 * One string of `cells` H-bridge cells, each on its own DC source `vdc`; cell k's output is
 * vdc·(left − right), left and right being the 0/1 states of its two legs' upper switches, and
 * the string's output is the sum of the cells (2·cells + 1 levels, k·vdc).
 *
 * - `phase-shifted` (McGrath and Holmes, 2002; Holmes and Lipo, 2003, ch. 11): each cell is a
 *   unipolar H-bridge, its left leg comparing +reference and its right leg −reference with one
 *   carrier delayed by (k − 1)·π/cells carrier radians (k = 1…cells), so the string's first
 *   carrier group sits at 2·cells·mf.
 * - level-shifted (`pd`, `pod`, `apod`): 2·cells bands; cell k takes the k-th band above zero
 *   (its left leg is high while the reference is above that band's carrier) and the k-th band
 *   below zero (its right leg is high while the reference is below that band's carrier), cell 1
 *   innermost. The cell then gives +vdc, 0 or −vdc, and the string's level index is the count of
 *   bands the reference is above.
 */
export function cascadedString(
  name: string,
  reference: ReferenceSignal,
  cells: number,
  arrangement: MultilevelCarrierArrangement,
  vdc: number,
  compare: CarrierComparator,
): MultilevelLeg {
  const pairs: { left: Waveform; right: Waveform }[] = [];
  if (arrangement === 'phase-shifted') {
    const negated = negatedReference(reference);
    for (let k = 0; k < cells; k++) {
      const delay = (k * Math.PI) / cells;
      pairs.push({ left: compare(reference, delay), right: compare(negated, delay) });
    }
  } else {
    const states = levelShiftedStates(reference, arrangement, 2 * cells, compare);
    for (let k = 0; k < cells; k++) {
      const above = states[cells + k] as Waveform;
      const below = states[cells - 1 - k] as Waveform;
      pairs.push({ left: above, right: complementState(below) });
    }
  }
  const cellOutputs = pairs.map(({ left, right }) =>
    combineWaveforms([left, right], ([l = 0, r = 0]) => vdc * (l - r)),
  );
  return {
    name,
    output: combineWaveforms(cellOutputs, (values) => values.reduce((s, v) => s + v, 0)),
    switches: pairs.flatMap(({ left, right }, k) => [
      { name: `cell ${k + 1} left upper`, on: left },
      { name: `cell ${k + 1} left lower`, on: complementState(left) },
      { name: `cell ${k + 1} right upper`, on: right },
      { name: `cell ${k + 1} right lower`, on: complementState(right) },
    ]),
    cells: cellOutputs.map((waveform, k) => ({ name: `cell ${k + 1}`, waveform })),
  };
}
