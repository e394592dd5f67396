import type { ZeroSequence } from './ZeroSequence.js';

/**
 * The zero-sequence offset (normalised to the carrier, ±1 = the rails) added to each phase
 * reference, given the three sinusoidal references at one instant.
 *
 * For the discontinuous clamps, the offset takes the chosen phase exactly to its rail; once the
 * references exceed the rails (ma past the linear range) the clamp still holds that phase there
 * and the others follow the same offset.
 *
 * @param sines - [a, b, c] = ma·sin(θ − k·2π/3), k = 0, 1, 2
 * @param theta - fundamental angle (radians), used by the 30°-shifted clamps and the third
 *   harmonic
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
      return -(max + min) / 2;
    case 'clamp-120-top':
      return 1 - max;
    case 'clamp-120-bottom':
      return -1 - min;
    case 'clamp-60-peak':
      return max + min >= 0 ? 1 - max : -1 - min;
    case 'clamp-60-lead':
    case 'clamp-60-lag': {
      // Decide the rail from the references shifted by ∓30°, then clamp the phase that is
      // extreme now: the clamping block moves by 30° against the peak (Holmes and Lipo ch. 7).
      const shift = zeroSequence === 'clamp-60-lead' ? Math.PI / 6 : -Math.PI / 6;
      const shifted = [0, 1, 2].map((k) => Math.sin(theta + shift - (k * 2 * Math.PI) / 3));
      const upper = Math.max(...shifted) + Math.min(...shifted) >= 0;
      return upper ? 1 - max : -1 - min;
    }
  }
}
