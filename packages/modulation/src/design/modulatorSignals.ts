import { sineReference } from '../carrier/sineReference.js';
import { triangleCarrier } from '../carrier/triangleCarrier.js';
import { TAU } from '../math.js';
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
  /** The unit triangle carrier; null for space vector (its switching is set by dwell times). */
  carrier: number[] | null;
}

/**
 * The reference and carrier a modulation compares, for the modulator chart: sine-triangle's
 * ma·sin θ against the unit triangle (Holmes and Lipo, 2003, ch. 3), three-phase carrier PWM's
 * phase-a reference with its zero sequence against the shared carrier (ch. 5 and 7; inverted
 * where a reduced common-mode method inverts phase a's, see `invertsCarrier`), space
 * vector's phase-a sine reference alone. Null for a stored pattern, which has no modulator.
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
  const ratio = modulation.method === 'space-vector' ? modulation.frequencyRatio : modulation.mf;
  const samples = Math.min(20_000, Math.max(points, 8 * ratio));
  const angles = Array.from({ length: samples + 1 }, (_, k) => (TAU * k) / samples);
  if (modulation.method === 'space-vector') {
    const reference = sineReference(spaceVectorIndices(modulation).ma);
    return { angles, reference: angles.map((t) => reference.value(t)), carrier: null };
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
