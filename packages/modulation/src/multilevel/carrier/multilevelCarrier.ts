import { compareWithCarrier } from '../../carrier/compareWithCarrier.js';
import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';
import { sineReference } from '../../carrier/sineReference.js';
import { threePhaseReference, type PhaseIndex } from '../../three-phase/threePhaseReference.js';
import type {
  MultilevelCarrierOptions,
  MultilevelLeg,
  MultilevelWaveforms,
} from '../MultilevelTypes.js';
import { assertMultilevelCarrierOptions } from './assertMultilevelCarrierOptions.js';
import { cascadedString } from './cascadedString.js';
import type { CarrierComparator } from './CarrierComparator.js';
import { flyingCapacitorLeg } from './flyingCapacitorLeg.js';
import { negatedReference } from './negatedReference.js';
import { threeLevelLeg } from './threeLevelLeg.js';

const PHASE_NAMES = ['a', 'b', 'c'] as const;

/**
 * A multilevel bridge under carrier PWM, one fundamental period, exact (no time step): every
 * edge is a crossing of a reference with a carrier, found by {@link compareWithCarrier} to
 * machine precision (natural sampling) or in closed form (regular sampling). Conventions of
 * `vdc`, the reference's normalisation and the carriers' alignment: see
 * {@link MultilevelCarrierOptions}.
 *
 * - Level-shifted carriers (`pd`, `pod`, `apod`; `npc`, `t-type`, `cascaded-h-bridge`):
 *   levels − 1 bands span ±1; each band's comparator is the reference mapped linearly into the
 *   band against the unit triangle (so each crossing is exact), in-phase carriers undelayed and
 *   opposed ones delayed by π; the leg's level index is the count of bands the reference is
 *   above (G. Carrara et al., IEEE Trans. Power Electron., 1992; B. P. McGrath and D. G. Holmes,
 *   IEEE Trans. Ind. Electron., 2002).
 * - Phase-shifted carriers: flying-capacitor cell k compares the whole reference with the carrier
 *   delayed by (k − 1)·2π/(levels − 1); cascaded cell k is a unipolar H-bridge whose carrier is
 *   delayed by (k − 1)·π/cells, which puts the string's first carrier group at 2·cells·mf
 *   (Holmes and Lipo, 2003, ch. 11).
 * - Three-phase: the references ma·sin(θ − k·2π/3) plus the zero sequence (`threePhaseReference`);
 *   single-phase `npc`, `t-type`, `flying-capacitor`: a full bridge, leg a on +ma·sin θ and leg b
 *   on −ma·sin θ with the same carriers (the output is leg a − leg b); single-phase cascaded:
 *   one string on ma·sin θ.
 *
 * Regular sampling: each carrier samples its own comparator's reference at its own peaks
 * (`regular-symmetric`) or peaks and valleys (`regular-asymmetric`), so carriers in opposition
 * or phase-shifted sample at their own instants, as each cell's modulator would.
 *
 * Switch names: `npc` and `t-type` `S1`…`S4` top to bottom; flying capacitor `cell k upper`,
 * `cell k lower` (k = 1 outermost); cascaded `cell k left upper`, `cell k left lower`,
 * `cell k right upper`, `cell k right lower`. In the linear range (ma ≤ 1, or ≤ 2/√3 with
 * `third-harmonic` or `min-max`) a leg's fundamental is ma times half its output range.
 *
 * @throws ParameterRangeError / ParameterTypeError naming `topology`, `levels`, `carriers`,
 *   `phaseCount`, `ma`, `mf`, `vdc`, `zeroSequence`, `sampling` or `carrierPhase`
 */
export function multilevelCarrier(options: MultilevelCarrierOptions): MultilevelWaveforms {
  assertMultilevelCarrierOptions(options);
  const {
    topology,
    levels,
    carriers,
    phaseCount,
    ma,
    mf,
    vdc,
    zeroSequence = 'none',
    sampling = 'natural',
    carrierPhase = 0,
  } = options;
  const compare: CarrierComparator = (reference, delay) =>
    compareWithCarrier(reference, {
      mf,
      carrierPhase: carrierPhase + delay,
      sampling,
      high: 1,
      low: 0,
    });
  const leg = (name: string, reference: ReferenceSignal): MultilevelLeg => {
    if (topology === 'cascaded-h-bridge') {
      return cascadedString(`string ${name}`, reference, (levels - 1) / 2, carriers, vdc, compare);
    }
    if (topology === 'flying-capacitor') {
      return flyingCapacitorLeg(`leg ${name}`, reference, levels, vdc, compare);
    }
    // The validator allows only level-shifted carriers for the three-level legs.
    if (carriers === 'phase-shifted') throw new Error('unreachable: checked by the validator');
    return threeLevelLeg(`leg ${name}`, reference, carriers, vdc, compare);
  };
  let legs: MultilevelLeg[];
  if (phaseCount === 3) {
    legs = PHASE_NAMES.map((name, phase) =>
      leg(name, threePhaseReference(phase as PhaseIndex, { ma, zeroSequence })),
    );
  } else if (topology === 'cascaded-h-bridge') {
    legs = [leg('a', sineReference(ma))];
  } else {
    const reference = sineReference(ma);
    legs = [leg('a', reference), leg('b', negatedReference(reference))];
  }
  return { phaseCount, levels, legs };
}
