import { TAU } from '../math.js';
import type { ReferenceSignal } from './ReferenceSignal.js';
import type { CarrierAlignment } from './triangleCarrier.js';

/** A reference and a carrier restated over a span of q fundamental periods mapped onto [0, 2π). */
export interface SpanCarrier {
  /** The reference at span angle φ: the original at θ = q·φ. */
  reference: ReferenceSignal;
  /** The carrier in span angles: p = q·mf cycles, phase chosen so it is the same carrier. */
  alignment: Required<CarrierAlignment>;
}

/**
 * Restates a reference and its carrier (frequency ratio mf = p/q) over q fundamental periods,
 * so that the comparator, which needs a whole number of carrier cycles per period, sees p
 * cycles in one span. With θ = q·φ the carrier phase x = mf·(θ − π/2) − c equals
 * p·(φ − π/2) − c′ for c′ = c − (p·π/2)(1 − 1/q) (taken modulo 2π, one carrier cycle), so a
 * carrier valley still sits at θ = π/2 with carrierPhase 0. The reference's breakpoints are
 * repeated in each of the q periods; it keeps half-wave antisymmetry over the span only for
 * odd q (θ + qπ is then an odd number of half periods on). With q = 1 both come back unchanged.
 * Internal: shared by sineTriangle and threePhase.
 */
export function spanCarrier(
  reference: ReferenceSignal,
  { mf, carrierPhase = 0 }: CarrierAlignment,
  fundamentalPeriods: number,
): SpanCarrier {
  const q = fundamentalPeriods;
  if (q === 1) return { reference, alignment: { mf, carrierPhase } };
  const p = Math.round(q * mf);
  const shifted = carrierPhase - ((p * Math.PI) / 2) * (1 - 1 / q);
  const breakpoints: number[] = [];
  for (let k = 0; k < q; k++) {
    for (const breakpoint of reference.breakpoints ?? [])
      breakpoints.push((breakpoint + k * TAU) / q);
  }
  return {
    reference: {
      value: (phi) => reference.value(q * phi),
      slopeBound: q * reference.slopeBound,
      breakpoints: breakpoints.sort((a, b) => a - b),
      halfWaveAntisymmetric: reference.halfWaveAntisymmetric === true && q % 2 === 1,
    },
    alignment: { mf: p, carrierPhase: shifted - TAU * Math.round(shifted / TAU) },
  };
}
