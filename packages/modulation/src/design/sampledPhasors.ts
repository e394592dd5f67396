import FFT from 'fft.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';

/**
 * The harmonic phasors, orders 0..maxOrder, of a period sampled at S = 2^k evenly spaced angles
 * (S > 2·maxOrder), by one FFT (the `fft.js` package), in the `harmonics` convention:
 * x = X₀ + Σ A_n·sin(nθ + φ_n), phasor A_n·e^{jφ_n}. With
 * F_n = Σ x_j·e^{−j2πnj/S} = (S/2)·A_n·e^{j(φ_n − π/2)}, A_n·e^{jφ_n} = (2/S)·j·F_n.
 * Exact for a band-limited x; otherwise the orders above S/2 alias (the caller samples densely).
 *
 * A signal that repeats r times a period is given by the S/r samples of its first repeat (on
 * the same grid): its order n·r is the transform's order n of those samples, by the same
 * formula with S/r for S, and every other order is zero (F over the whole period is r times
 * the transform of the repeat at multiples of r and zero elsewhere, the DFT's decimation).
 * Internal: the spectrum of the sampled DC-link current.
 * @param samples - S/r samples: one repeat, at angles 2πj/S
 * @param maxOrder - highest order kept, at most S/2 − 1 (fewer are returned when above)
 * @param fft - a transform of size S/r to reuse (its tables cost as much as a transform)
 * @param repeats - r, the whole number of times the signal repeats a period. @default 1
 */
export function sampledPhasors(
  samples: Float64Array,
  maxOrder: number,
  fft: FFT = new FFT(samples.length),
  repeats = 1,
): HarmonicPhasors {
  const size = samples.length;
  if (fft.size !== size) throw new RangeError(`fft.size ${fft.size} is not ${size}`);
  const output = new Float64Array(2 * size);
  fft.realTransform(output, samples);
  const count = Math.min(maxOrder, (repeats * size) / 2 - 1) + 1;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  re[0] = (output[0] as number) / size;
  for (let n = 1, order = repeats; order < count; n++, order += repeats) {
    // (2/S)·j·(F.re + j·F.im) = (2/S)·(−F.im + j·F.re)
    re[order] = (-2 / size) * (output[2 * n + 1] as number);
    im[order] = (2 / size) * (output[2 * n] as number);
  }
  return { re, im };
}
