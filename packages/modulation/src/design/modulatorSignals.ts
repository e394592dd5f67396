import { sineReference } from '../carrier/sineReference.js';
import { triangleCarrier } from '../carrier/triangleCarrier.js';
import { TAU } from '../math.js';
import { levelShiftedBandDelay } from '../multilevel/carrier/levelShiftedBandDelay.js';
import type { MultilevelCarrierOptions } from '../multilevel/MultilevelTypes.js';
import { spaceVectorIndices } from '../space-vector/spaceVectorIndices.js';
import { invertsCarrier } from '../three-phase/invertsCarrier.js';
import { threePhaseReference } from '../three-phase/threePhaseReference.js';
import { assertNumberInRange } from '../validation/assertions.js';
import type { Modulation } from './Modulation.js';

/** What a carrier modulator compares, sampled over one period, per unit of the carrier peak. */
export interface ModulatorSignals {
  /** Radians, evenly spaced over [0, 2π]. */
  angles: number[];
  /** Phase a's reference (with its zero sequence for three-phase carrier PWM). */
  reference: number[];
  /**
   * The unit triangle carrier; null for space vector (its switching is set by dwell times) and
   * for a multilevel carrier modulator, which compares with several (`carriers`).
   */
  carrier: number[] | null;
  /**
   * A multilevel carrier modulator's carriers, each over `angles`: the level-shifted bands
   * lowest first, or the phase-shifted carriers cell 1 first. Left out for the other methods.
   */
  carriers?: number[][];
}

/**
 * The reference and carrier a modulation compares, for the modulator chart: sine-triangle's
 * ma·sin θ against the unit triangle (Holmes and Lipo, 2003, ch. 3), three-phase carrier PWM's
 * phase-a reference with its zero sequence against the shared carrier (ch. 5 and 7; inverted
 * where a reduced common-mode method inverts phase a's, see `invertsCarrier`), space
 * vector's (two- or three-level) phase-a sine reference alone, a multilevel carrier modulator's phase-a reference
 * against every one of its carriers (McGrath and Holmes, 2002; Holmes and Lipo, 2003, ch. 11). Null for a stored pattern, which has no modulator.
 *
 * @param points - samples over the period, integer in [64, 20000]; at least 8 a carrier period
 *   are taken when mf needs more (up to 20000)
 */
export function modulatorSignals(modulation: Modulation, points = 1200): ModulatorSignals | null {
  assertNumberInRange('points', points, { min: 64, max: 20_000, integer: true });
  if (
    modulation.method === 'selective-harmonic-elimination' ||
    modulation.method === 'optimal-pattern'
  )
    return null;
  const ratio = 'frequencyRatio' in modulation ? modulation.frequencyRatio : modulation.mf;
  const samples = Math.min(20_000, Math.max(points, 8 * ratio));
  const angles = Array.from({ length: samples + 1 }, (_, k) => (TAU * k) / samples);
  if (modulation.method === 'space-vector' || modulation.method === 'multilevel-space-vector') {
    const reference = sineReference(spaceVectorIndices(modulation).ma);
    return { angles, reference: angles.map((t) => reference.value(t)), carrier: null };
  }
  if (modulation.method === 'multilevel-carrier') {
    const reference =
      modulation.phaseCount === 3
        ? threePhaseReference(0, {
            ma: modulation.ma,
            zeroSequence: modulation.zeroSequence ?? 'none',
          })
        : sineReference(modulation.ma);
    return {
      angles,
      reference: angles.map((t) => reference.value(t)),
      carrier: null,
      carriers: multilevelCarriers(modulation).map((carrier) => angles.map(carrier)),
    };
  }
  const reference =
    modulation.method === 'three-phase'
      ? threePhaseReference(0, {
          ma: modulation.ma,
          ...(modulation.zeroSequence ? { zeroSequence: modulation.zeroSequence } : {}),
        })
      : sineReference(modulation.ma);
  const alignment = { mf: modulation.mf, carrierPhase: modulation.carrierPhase ?? 0 };
  const zeroSequence = modulation.method === 'three-phase' ? modulation.zeroSequence : undefined;
  return {
    angles,
    reference: angles.map((t) => reference.value(t)),
    // The reduced common-mode methods compare phase a with the inverted carrier while it is the
    // middle phase: the chart shows the carrier phase a really meets.
    carrier: angles.map((t) =>
      zeroSequence !== undefined && invertsCarrier(zeroSequence, 0, t, alignment)
        ? -triangleCarrier(t, alignment)
        : triangleCarrier(t, alignment),
    ),
  };
}

/**
 * The carriers of a multilevel carrier modulator as functions of the fundamental angle, per unit
 * of the reference's full range (conventions of `multilevelCarrier`): levels − 1 level-shifted
 * bands of width 2/(levels − 1), band k's carrier low_k + (c + 1)/(levels − 1) with c the unit
 * triangle delayed as the arrangement says (`levelShiftedBandDelay`); or one full-range carrier
 * per cell, delayed by (k − 1)·2π/(levels − 1) (flying capacitor) or (k − 1)·π/cells (cascaded).
 */
function multilevelCarriers(
  options: Pick<
    MultilevelCarrierOptions,
    'topology' | 'levels' | 'carriers' | 'mf' | 'carrierPhase'
  >,
): ((theta: number) => number)[] {
  const { topology, levels, carriers, mf, carrierPhase = 0 } = options;
  const delayed = (delay: number) => (theta: number) =>
    triangleCarrier(theta, { mf, carrierPhase: carrierPhase + delay });
  if (carriers === 'phase-shifted') {
    const cells = topology === 'cascaded-h-bridge' ? (levels - 1) / 2 : levels - 1;
    const step = topology === 'cascaded-h-bridge' ? Math.PI / cells : TAU / cells;
    return Array.from({ length: cells }, (_, k) => delayed(k * step));
  }
  const bands = levels - 1;
  return Array.from({ length: bands }, (_, k) => {
    const carrier = delayed(levelShiftedBandDelay(carriers, k, bands));
    const low = -1 + (2 * k) / bands;
    return (theta: number) => low + (carrier(theta) + 1) / bands;
  });
}
