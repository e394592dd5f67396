import { designFrequencyRatio } from './designFrequencyRatio.js';
import type { InverterDesign } from './InverterDesign.js';
import type { Modulation } from './Modulation.js';

/**
 * The full {@link Modulation} of a design: its `modulation` with the design's DC bus and, for
 * the carrier methods and space vector, the frequency ratio carrierFrequency/fundamentalFrequency
 * (as `mf`, or `frequencyRatio` for space vector). A multilevel design's `vdc` is the whole DC
 * link (NPC, T-type, flying capacitor) or each cell's source (cascaded H-bridge), and
 * carrierFrequency is each carrier's frequency.
 * @throws ParameterRangeError naming `carrierFrequency` when the ratio is not a whole number
 */
export function designModulation(design: InverterDesign): Modulation {
  const { modulation, vdc } = design;
  switch (modulation.method) {
    case 'sine-triangle':
    case 'three-phase':
    case 'multilevel-carrier':
      return { ...modulation, vdc, mf: designFrequencyRatio(design) };
    case 'space-vector':
    case 'multilevel-space-vector':
      return { ...modulation, vdc, frequencyRatio: designFrequencyRatio(design) };
    case 'selective-harmonic-elimination':
    case 'optimal-pattern':
      return { ...modulation, vdc };
  }
}
