import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';

/**
 * The reference restated against the unit triangle of one level-shifted band. With `bands`
 * contiguous bands of width 2/bands spanning ±1, band k (k = 0 lowest) runs from
 * lo = −1 + 2k/bands; its carrier lo + (c + 1)/bands, c the unit triangle, meets the reference r
 * exactly where bands·(r − lo) − 1 = c. The map is linear, so comparing the mapped reference with
 * the unit triangle gives the band's crossings exactly (McGrath and Holmes, IEEE Trans. Ind.
 * Electron., 2002).
 */
export function bandReference(
  reference: ReferenceSignal,
  band: number,
  bands: number,
): ReferenceSignal {
  const low = -1 + (2 * band) / bands;
  const result: ReferenceSignal = {
    value: (theta) => bands * (reference.value(theta) - low) - 1,
    slopeBound: bands * reference.slopeBound,
  };
  if (reference.breakpoints !== undefined) result.breakpoints = reference.breakpoints;
  return result;
}
