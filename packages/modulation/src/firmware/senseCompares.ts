import type { CompareSense } from './timerTableTypes.js';

/** Counts within which two ideal thresholds are one (rounding of the references, ~1e−13 of full). */
const TIE_TOLERANCE = 1e-9;

/**
 * Internal to timerTable: every channel's compare values (high-side on-time in counts per update)
 * from its duties and compare senses (channel-major arrays).
 *
 * - `'below'`: round(duty·full), as every table rounds.
 * - `'above'`: full − v with v the counter threshold full·(1 − duty) rounded, not the on-time:
 *   rounding is monotone, so a threshold that lies between the normal legs' thresholds (the
 *   zero-vector-free condition of the reduced common-mode methods, A. M. Hava and E. Ün, 2009)
 *   stays between their rounded values. Where it equals a normal leg's threshold in exact
 *   arithmetic (the middle phase tied with another at a 30° boundary, or r_max + r_min = 0 of the
 *   min-max waves) rounding noise of the last bit could put the two on either side of a half
 *   count and give one tick of 000 or 111: such a tie (within 1e−9 of a count) takes that leg's
 *   rounded value itself.
 */
export function senseCompares(
  duties: readonly (readonly number[])[],
  senses: readonly (readonly CompareSense[])[],
  full: number,
): number[][] {
  return duties.map((duty, k) =>
    duty.map((d, i) => {
      if (senses[k]?.[i] !== 'above') return Math.round(d * full);
      const threshold = (1 - d) * full;
      const tied = duties.findIndex(
        (other, m) =>
          senses[m]?.[i] !== 'above' &&
          Math.abs((other[i] as number) * full - threshold) <= TIE_TOLERANCE * full,
      );
      const v =
        tied >= 0 ? Math.round((duties[tied]?.[i] as number) * full) : Math.round(threshold);
      return full - v;
    }),
  );
}
