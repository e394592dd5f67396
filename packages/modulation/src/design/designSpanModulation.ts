import { designModulation } from './designModulation.js';
import type { InverterDesign } from './InverterDesign.js';
import type { Modulation } from './Modulation.js';

/**
 * The full {@link Modulation} of an asynchronous-capable carrier design (`ASYNCHRONOUS_METHODS`)
 * at the frequency ratio p/q it is analysed at: `designModulation` of the design with its carrier
 * moved to the nearest whole multiple of the fundamental (so every other field is checked by the
 * design's own rules), then `mf` (or space vector's `frequencyRatio`) set to p/q.
 * The report of such a design (`analyseDesign`, `DesignReport.carrierSpan`) and
 * `asynchronousDesignSpectra` build its voltages from this modulation over q periods.
 * @param ratio - p/q, the ratio analysed (`designRationalRatio`), in [1, 1000]
 * @throws ParameterRangeError / ParameterTypeError naming the field, as designModulation
 */
export function designSpanModulation(design: InverterDesign, ratio: number): Modulation {
  const whole = designModulation({
    ...design,
    carrierFrequency: Math.max(1, Math.round(ratio)) * design.fundamentalFrequency,
  });
  return whole.method === 'space-vector'
    ? { ...whole, frequencyRatio: ratio }
    : whole.method === 'sine-triangle' || whole.method === 'three-phase'
      ? { ...whole, mf: ratio }
      : whole;
}
