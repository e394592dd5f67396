/** The stretch of a capture that {@link wholePeriods} picks for analysis. */
export interface WholePeriodSpan {
  /** Samples from the first one: the transform's length. */
  length: number;
  /** Whole fundamental periods in those samples (0 when not even one fits). */
  periods: number;
  /** True when the capture repeats exactly (to {@link PERIODIC_TOLERANCE} of its peak) over them. */
  periodic: boolean;
}

/**
 * Samples of a periodic capture may differ from the same samples one repetition later by this
 * fraction of the capture's largest magnitude: rounding of synthesised or exported values, far
 * below any instrument's noise, so a measured capture is never taken for an exactly periodic one.
 */
export const PERIODIC_TOLERANCE = 1e-9;

/**
 * Finds the longest stretch from the first sample that holds a whole number of fundamental
 * periods. The capture is taken as exactly periodic when, for some q whole periods that round
 * to s samples (s = round(q·sampleRate/f₀) or one either side, as f₀ may be an estimate), every
 * sample equals the one s later to {@link PERIODIC_TOLERANCE}; the span is then ⌊N/s⌋·s samples
 * holding ⌊N/s⌋·q periods, and the transform of that length puts every harmonic exactly on a
 * bin (coherent sampling: F. J. Harris, Proc. IEEE 66(1), 1978, §II). Otherwise the span is the
 * ⌊N·f₀/fs⌋ periods that fit, rounded to a sample, to be read with a window.
 *
 * @param samples - the capture, finite numbers
 * @param sampleRate - hertz, > 0
 * @param fundamentalFrequency - hertz, > 0, given or estimated
 */
export function wholePeriods(
  samples: readonly number[],
  sampleRate: number,
  fundamentalFrequency: number,
): WholePeriodSpan {
  const count = samples.length;
  const perPeriod = sampleRate / fundamentalFrequency;
  const fitting = Math.floor(count / perPeriod);
  const peak = samples.reduce((max, x) => Math.max(max, Math.abs(x)), 0);
  const tolerance = PERIODIC_TOLERANCE * peak;
  // A repetition is only seen when the capture holds it twice: q periods up to half the record.
  // The search stops after comparing 16 samples for each one captured, so a capture that repeats
  // for long stretches without being periodic costs no more than a few passes over it.
  const budget = { left: 16 * count };
  for (let q = 1; 2 * q * perPeriod <= count + 1 && budget.left > 0; q++) {
    const centre = Math.round(q * perPeriod);
    for (const shift of [centre, centre - 1, centre + 1]) {
      if (shift < 1 || 2 * shift > count) continue;
      if (repeatsAfter(samples, shift, tolerance, budget)) {
        const blocks = Math.floor(count / shift);
        return { length: blocks * shift, periods: blocks * q, periodic: true };
      }
    }
  }
  if (fitting < 1) return { length: count, periods: 0, periodic: false };
  return {
    length: Math.min(count, Math.round(fitting * perPeriod)),
    periods: fitting,
    periodic: false,
  };
}

/**
 * Whether x[i + shift] equals x[i] to `tolerance` for every i; stops at the first that does not,
 * or (false) when the comparisons left in `budget` run out.
 */
function repeatsAfter(
  samples: readonly number[],
  shift: number,
  tolerance: number,
  budget: { left: number },
): boolean {
  for (let i = 0; i + shift < samples.length; i++) {
    if (--budget.left < 0) return false;
    if (Math.abs((samples[i + shift] as number) - (samples[i] as number)) > tolerance) return false;
  }
  return true;
}
