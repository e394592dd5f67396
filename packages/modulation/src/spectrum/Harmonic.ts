/**
 * One Fourier component of a periodic voltage: `amplitude · sin(order·θ + phase)`.
 *
 * - `order`: multiple of the fundamental (0 is the mean, 1 the fundamental).
 * - `amplitude`: peak volts (for order 0, the signed mean in volts, with phase 0).
 * - `phase`: radians in (−π, π], relative to sin(order·θ); a component in phase with the
 *   reference `ma·sin θ` has phase 0.
 */
export interface Harmonic {
  order: number;
  amplitude: number;
  phase: number;
}
