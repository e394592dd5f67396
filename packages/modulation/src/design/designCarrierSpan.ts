import { designRationalRatio, type RationalRatio } from './designRationalRatio.js';
import type { InverterDesign } from './InverterDesign.js';
import { CARRIER_METHODS, type ModulationMethod } from './Modulation.js';

/**
 * The carrier methods whose voltages can be built over several fundamental periods (a carrier
 * span): sine-triangle, three-phase carrier and space vector. The multilevel methods are built
 * over one period, so they need a whole mf.
 */
export const ASYNCHRONOUS_METHODS: readonly ModulationMethod[] = CARRIER_METHODS.filter(
  (m) => m !== 'multilevel-carrier' && m !== 'multilevel-space-vector',
);

/** Relative distance from a whole number within which carrier/fundamental counts as whole (as designFrequencyRatio). */
const WHOLE_RATIO_TOLERANCE = 1e-9;

/**
 * Whether a design's carrier makes its pattern repeat only after several fundamental periods:
 * for an {@link ASYNCHRONOUS_METHODS} design whose ratio carrierFrequency/fundamentalFrequency
 * is not a whole number (to 1e−9 relative, the rounding of decimal inputs), its nearest p/q with
 * q ≤ 64 and the carrier error in hertz (`designRationalRatio`); null for a whole ratio, a
 * multilevel method or a stored pattern, which `analyseDesign` analyses over one period. With a
 * ratio, `analyseDesign` computes every figure over the span of q periods (`DesignReport.carrierSpan`).
 * @throws ParameterRangeError naming `carrierFrequency` when the ratio is outside [1, 1000]
 */
export function designCarrierSpan(design: InverterDesign): RationalRatio | null {
  if (!ASYNCHRONOUS_METHODS.includes(design.modulation.method)) return null;
  const ratio = designRationalRatio(design);
  const whole =
    ratio.q === 1 &&
    Math.abs(ratio.error) <= WHOLE_RATIO_TOLERANCE * ratio.p * design.fundamentalFrequency;
  return whole ? null : ratio;
}
