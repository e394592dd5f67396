/**
 * Balanced sinusoidal phase currents: phase k (k = 0, 1, 2 for a, b, c; only k = 0 for a
 * single-phase bridge) carries peakCurrent·sin(θ − k·2π/3 − currentAngle), amperes, out of its
 * leg (string) into the load. `currentAngle` is the power-factor angle φ by which the current lags
 * the phase's sine reference, as in the loss model's `LossOperatingPoint`.
 */
export interface SinusoidalPhaseCurrents {
  /** Peak of each phase current, A, in [0, 1e6]. */
  peakCurrent: number;
  /** Power-factor angle φ, rad, in [−π, π]. @default 0 */
  currentAngle?: number;
}

/**
 * The phase currents the multilevel balance and loss figures take, amperes, positive out of the
 * leg (string) into the load:
 * - samples: one array per phase (3 for a three-phase bridge, 1 for a single-phase one), each of
 *   the same length S in [4, 2^20], sample j at θ = 2πj/S over one fundamental period (the design
 *   report's inverter-current samples), each within ±1e6 A; between samples the current is taken as linear (exact integrals
 *   of that interpolation against the switching functions);
 * - or {@link SinusoidalPhaseCurrents} (exact closed-form integrals).
 *
 * A single-phase bridge of two legs (`npc`, `t-type`, `flying-capacitor`) carries the bridge
 * current i out of leg a and back into leg b (leg b's current is −i); a single-phase cascaded
 * string carries i.
 */
export type MultilevelPhaseCurrents =
  readonly (Float64Array | readonly number[])[] | SinusoidalPhaseCurrents;
