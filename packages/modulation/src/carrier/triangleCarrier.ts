import { HALF_PI } from '../math.js';

/** Where the unit triangle carrier sits relative to the fundamental. */
export interface CarrierAlignment {
  /** Carrier cycles per fundamental period (frequency ratio mf). */
  mf: number;
  /**
   * Delay of the carrier in radians of the carrier cycle. At 0 a carrier valley (−1) sits at
   * θ = π/2, the positive peak of the reference `ma·sin θ` (Holmes and Lipo, 2003, ch. 3).
   * @default 0
   */
  carrierPhase?: number;
}

/**
 * The carrier's own phase x = mf·(θ − π/2) − carrierPhase, in carrier radians: valleys at
 * x = 2πk, peaks at x = (2k + 1)π.
 */
export function carrierAngle(theta: number, { mf, carrierPhase = 0 }: CarrierAlignment): number {
  return mf * (theta - HALF_PI) - carrierPhase;
}

/**
 * The fundamental angle θ (radians, unwrapped) at which the carrier's phase is x; the inverse of
 * {@link carrierAngle}.
 */
export function fundamentalAngleOfCarrier(
  x: number,
  { mf, carrierPhase = 0 }: CarrierAlignment,
): number {
  return HALF_PI + (x + carrierPhase) / mf;
}

/**
 * The unit triangle carrier at fundamental angle `theta` (radians): rises linearly from −1 at a
 * valley to +1 at a peak and back, `mf` times per fundamental period.
 * @returns a value in [−1, 1]
 */
export function triangleCarrier(theta: number, alignment: CarrierAlignment): number {
  const x = carrierAngle(theta, alignment);
  const u = x - 2 * Math.PI * Math.floor(x / (2 * Math.PI));
  return u <= Math.PI ? -1 + (2 * u) / Math.PI : 3 - (2 * u) / Math.PI;
}
