import { thirtyDegreeSector } from './thirtyDegreeSector.js';
import type { ZeroSequence } from './ZeroSequence.js';

/**
 * The zero-sequence offset (normalised to the carrier, ±1 = the rails) added to each phase
 * reference, given the three sinusoidal references at one instant.
 *
 * The reduced common-mode methods take the offsets of their modulation waves: `azspwm1` that of
 * `min-max`, `nspwm` that of `dpwm1` (their carriers differ, see {@link invertsCarrier}).
 *
 * For the discontinuous clamps, the offset takes the chosen phase exactly to its rail; once the
 * references exceed the rails (ma past the linear range) the clamp still holds that phase there
 * and the others follow the same offset.
 *
 * The 60° clamps choose the rail by the 30° interval θ lies in, not by comparing the sines
 * (Holmes and Lipo 2003, ch. 7: dpwm1 takes the positive rail on [60°, 120°),
 * [180°, 240°) and [300°, 360°), where phase a, b or c is at its positive peak, and the negative
 * rail between; lead advances those blocks by 30°, lag delays them by 30°). The blocks are
 * half-open, [start, end); at a boundary the two candidate phases tie in magnitude, and the
 * sines' comparison was decided there, and a few ulp either side, by rounding. Decided by
 * interval, the offset is exactly 2π/3-periodic and changes sign at θ + π. On a boundary itself
 * rounding of θ still picks the side; `compareWithCarrier` never evaluates there (it reads a
 * held sample that lands on a boundary just after it).
 *
 * @param sines - [a, b, c] = ma·sin(θ − k·2π/3), k = 0, 1, 2
 * @param theta - fundamental angle (radians, any finite value), used by the 60° clamps and the
 *   third harmonic
 * @param ma - modulation index, for the third harmonic's amplitude ma/6
 */
export function zeroSequenceOffset(
  zeroSequence: ZeroSequence,
  sines: readonly [number, number, number],
  theta: number,
  ma: number,
): number {
  const [a, b, c] = sines;
  const max = Math.max(a, b, c);
  const min = Math.min(a, b, c);
  switch (zeroSequence) {
    case 'none':
      return 0;
    case 'third-harmonic':
      return (ma / 6) * Math.sin(3 * theta);
    case 'min-max':
    case 'azspwm1':
      return -(max + min) / 2;
    case 'dpwm-max':
      return 1 - max;
    case 'dpwm-min':
      return -1 - min;
    case 'dpwm1':
    case 'dpwm0':
    case 'dpwm2':
      return clampsHigh(zeroSequence, thirtyDegreeSector(theta)) ? 1 - max : -1 - min;
    case 'nspwm':
      return clampsHigh('dpwm1', thirtyDegreeSector(theta)) ? 1 - max : -1 - min;
  }
}

/**
 * True when a 60° clamp holds the positive rail in the 30° interval `sector` (0…11): the 60°
 * blocks [60°, 120°), [180°, 240°), [300°, 360°) for the peak clamp, advanced by 30° for lead
 * and delayed by 30° for lag (the block moves against the peak, Holmes and Lipo ch. 7).
 */
function clampsHigh(zeroSequence: 'dpwm1' | 'dpwm0' | 'dpwm2', sector: number): boolean {
  const shift = zeroSequence === 'dpwm1' ? 0 : zeroSequence === 'dpwm0' ? 1 : 11;
  return Math.floor(((sector + shift) % 12) / 2) % 2 === 1;
}
