import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';
import type { MultilevelLeg } from '../MultilevelTypes.js';
import type { CarrierComparator } from './CarrierComparator.js';
import { complementState } from './complementState.js';
import { countStates } from './countStates.js';

/**
 * One flying-capacitor leg of `levels` levels under phase-shifted carriers (T. A. Meynard and
 * H. Foch, 1992; Holmes and Lipo, 2003, ch. 11): commutation cell k (k = 1 outermost … levels − 1)
 * compares the whole reference with the unit triangle delayed by (k − 1)·2π/(levels − 1) carrier
 * radians; its upper switch is on while the reference is above, its lower switch is the
 * complement. Each cell at 1 adds vdc/(levels − 1), so the output to the DC midpoint is
 * −vdc/2 + (cells at 1)·vdc/(levels − 1).
 */
export function flyingCapacitorLeg(
  name: string,
  reference: ReferenceSignal,
  levels: number,
  vdc: number,
  compare: CarrierComparator,
): MultilevelLeg {
  const cellCount = levels - 1;
  const states = Array.from({ length: cellCount }, (_, k) =>
    compare(reference, (k * 2 * Math.PI) / cellCount),
  );
  return {
    name,
    output: countStates(states, vdc / cellCount, -vdc / 2),
    switches: states.flatMap((state, k) => [
      { name: `cell ${k + 1} upper`, on: state },
      { name: `cell ${k + 1} lower`, on: complementState(state) },
    ]),
    cells: states.map((state, k) => ({ name: `cell ${k + 1}`, waveform: state })),
  };
}
