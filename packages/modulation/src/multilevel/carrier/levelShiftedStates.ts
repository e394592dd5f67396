import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';
import type { Waveform } from '../../waveform/Waveform.js';
import type { MultilevelCarrierArrangement } from '../MultilevelTypes.js';
import { bandReference } from './bandReference.js';
import type { CarrierComparator } from './CarrierComparator.js';
import { levelShiftedBandDelay } from './levelShiftedBandDelay.js';

/**
 * The 0/1 state of every level-shifted band, lowest first: 1 while the reference is above that
 * band's carrier. The bands are ordered and each carrier stays inside its own band, so the
 * count of bands at 1 is the level index of the output (McGrath and Holmes, 2002).
 */
export function levelShiftedStates(
  reference: ReferenceSignal,
  arrangement: Exclude<MultilevelCarrierArrangement, 'phase-shifted'>,
  bands: number,
  compare: CarrierComparator,
): Waveform[] {
  return Array.from({ length: bands }, (_, band) =>
    compare(bandReference(reference, band, bands), levelShiftedBandDelay(arrangement, band, bands)),
  );
}
