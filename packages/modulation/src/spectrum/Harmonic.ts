/**
 * One Fourier component of a periodic voltage: `amplitude · sin(order·θ + phase)`.
 *
 * - `order`: multiple of the fundamental (0 is the mean, 1 the fundamental).
 * - `amplitude`: peak volts, never negative. For order 0 it is the mean's magnitude and the
 *   phase its sign: phase 0 for a mean ≥ 0, π below, so the mean is `amplitude·cos(phase)`.
 * - `phase`: radians in (−π, π], relative to sin(order·θ); a component in phase with the
 *   reference `ma·sin θ` has phase 0.
 */
export interface Harmonic {
  order: number;
  amplitude: number;
  phase: number;
}
