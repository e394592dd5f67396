/**
 * A modulating reference normalised to the carrier (±1 spans the DC bus), as a function of the
 * fundamental angle θ in radians. Periodic in 2π.
 */
export interface ReferenceSignal {
  /** The reference value at θ (radians). */
  value: (theta: number) => number;
  /**
   * An upper bound of |d value/dθ| between breakpoints (per radian); sets how finely each
   * carrier half-period is searched for crossings.
   */
  slopeBound: number;
  /**
   * Angles in [0, 2π) where the reference has a kink or a jump (the clamping instants of
   * discontinuous zero sequences); the crossing search splits there, and a regular sample that
   * falls on one takes the value just after it.
   * @default []
   */
  breakpoints?: readonly number[];
  /**
   * True when value(θ + π) = −value(θ) exactly (sines, odd zero sequences): with odd mf the
   * comparator then needs only half a period, and the output has half-wave symmetry.
   * @default false
   */
  halfWaveAntisymmetric?: boolean;
}
