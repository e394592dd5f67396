import { designFrequencyRatio } from './designFrequencyRatio.js';
import type { InverterDesign } from './InverterDesign.js';
import type { Modulation } from './Modulation.js';

/**
 * The full {@link Modulation} of a design: its `modulation` with the design's DC bus and, for
 * the carrier methods and space vector, the frequency ratio carrierFrequency/fundamentalFrequency
 * (as `mf`, or `frequencyRatio` for space vector).
 * @throws ParameterRangeError naming `carrierFrequency` when the ratio is not a whole number
 */
export function designModulation(design: InverterDesign): Modulation {
  const { modulation, vdc } = design;
  switch (modulation.method) {
    case 'sine-triangle':
    case 'three-phase':
      return { ...modulation, vdc, mf: designFrequencyRatio(design) };
    case 'space-vector':
      return { ...modulation, vdc, frequencyRatio: designFrequencyRatio(design) };
    case 'selective-harmonic-elimination':
    case 'optimal-pattern':
      return { ...modulation, vdc };
  }
}
