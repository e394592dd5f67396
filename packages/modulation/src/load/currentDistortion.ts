/** The distortion of a current from its RMS and its fundamental; a plain serialisable object. */
export interface CurrentDistortion {
  /** √(I² − I₁²)/I₁ with I₁ the fundamental's RMS: all but the fundamental (any mean included), a ratio; null without a fundamental. */
  thd: number | null;
  /** I₁/I, a ratio in [0, 1]: the fundamental's share of the RMS (1 for a sine); 0 for a zero current. */
  distortionFactor: number;
}

/**
 * A current's total harmonic distortion and distortion factor, as power electronics defines
 * them for a non-sinusoidal current: THD = I_dis/I₁ with I_dis = √(I² − I₁²), and
 * DF = I₁/I = 1/√(1 + THD²) (N. Mohan, T. M. Undeland, W. P. Robbins, Power Electronics,
 * Wiley, 3rd ed. 2003, ch. 5, from memory). For a motor the distortion is what heats the
 * winding without making torque.
 *
 * @param rms - the current's RMS, amperes, ≥ 0
 * @param fundamental - its fundamental, peak amperes, ≥ 0
 * Internal: part of analyseDesign.
 */
export function currentDistortion(rms: number, fundamental: number): CurrentDistortion {
  const first = fundamental / Math.SQRT2;
  const distortion = Math.sqrt(Math.max(0, rms * rms - first * first));
  return {
    thd: first > 0 ? distortion / first : null,
    distortionFactor: rms > 0 ? Math.min(1, first / rms) : 0,
  };
}
