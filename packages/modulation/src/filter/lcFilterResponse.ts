import { TAU } from '../math.js';
import { assertFiniteArray } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import { assertLcFilter } from './assertLcFilter.js';
import type { LcFilterOptions } from './LcFilterOptions.js';
import { lcFilterTransfer } from './lcFilterTransfer.js';

/** The most frequencies one call of {@link lcFilterResponse} evaluates. */
export const MAX_RESPONSE_FREQUENCIES = 1_000_000;

/** Frequency response of a filter; parallel plain arrays, one entry per frequency. */
export interface LcFilterResponse {
  /** Hertz, as given. */
  frequencies: number[];
  /** |H(j2πf)|, a ratio (1 is 0 dB). */
  magnitude: number[];
  /** 20·log10|H|, decibels. */
  magnitudeDb: number[];
  /** arg H, radians in (−π, π]: output relative to input (negative is a lag). */
  phase: number[];
}

/**
 * H(jω) = V_out/V_in of an LC output filter at each frequency (standard circuit analysis:
 * voltage divider H = 1/(1 + Z_series·Y_shunt) with Z = jωL, Y = jωC, resistors real).
 *
 * @param frequencies - hertz, each ≥ 0, at most 1 000 000
 * @param filter - the filter (henries, farads, ohms)
 * @throws ParameterRangeError naming the field; `frequencies[i]` when |H| there is not a
 *   finite non-zero double (an undamped filter exactly at resonance, or ω²LC overflowing),
 *   so `magnitudeDb` and `phase` are always finite
 */
export function lcFilterResponse(
  frequencies: readonly number[],
  filter: LcFilterOptions,
): LcFilterResponse {
  assertFiniteArray('frequencies', frequencies, 0, MAX_RESPONSE_FREQUENCIES);
  frequencies.forEach((f, i) => {
    if (f < 0) throw new ParameterRangeError(`frequencies[${i}]`, 'a finite number ≥ 0 (hertz)', f);
  });
  assertLcFilter(filter);
  const magnitude: number[] = [];
  const magnitudeDb: number[] = [];
  const phase: number[] = [];
  for (const f of frequencies) {
    const h = lcFilterTransfer(filter, TAU * f);
    const m = Math.hypot(h.re, h.im);
    if (!Number.isFinite(m) || !(m > 0) || !Number.isFinite(h.re) || !Number.isFinite(h.im)) {
      const i = magnitude.length;
      throw new ParameterRangeError(
        `frequencies[${i}]`,
        `a frequency at which this filter's gain is a finite, non-zero double (|H| = ${m} here; l·c·ω² overflows or the filter is undamped at resonance)`,
        f,
      );
    }
    magnitude.push(m);
    magnitudeDb.push(20 * Math.log10(m));
    phase.push(Math.atan2(h.im, h.re));
  }
  return { frequencies: [...frequencies], magnitude, magnitudeDb, phase };
}
