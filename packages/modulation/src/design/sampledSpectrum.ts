import FFT from 'fft.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import { meanHarmonic } from '../spectrum/meanHarmonic.js';

/**
 * Harmonics 0..maxOrder of one period sampled at S = 2^k evenly spaced angles (S > 2·maxOrder),
 * by one FFT (the `fft.js` package), in the `harmonics` convention: x = X₀ + Σ A_n·sin(nθ + φ_n).
 * With F_n = Σ x_j·e^{−j2πnj/S} = (S/2)·A_n·e^{j(φ_n − π/2)}, A_n·e^{jφ_n} = (2/S)·j·F_n.
 * Exact for a band-limited x; otherwise the orders above S/2 alias (the caller samples densely).
 * Internal: the spectrum of the sampled DC-link current.
 * @param fft - a transform of size S to reuse (its tables cost as much as a transform)
 */
export function sampledSpectrum(
  samples: Float64Array,
  maxOrder: number,
  fft: FFT = new FFT(samples.length),
): Harmonic[] {
  const size = samples.length;
  if (fft.size !== size) throw new RangeError(`fft.size ${fft.size} is not ${size}`);
  const output = new Float64Array(2 * size);
  fft.realTransform(output, samples);
  const spectrum: Harmonic[] = [meanHarmonic((output[0] as number) / size)];
  for (let n = 1; n <= maxOrder && n < size / 2; n++) {
    const re = output[2 * n] as number;
    const im = output[2 * n + 1] as number;
    // (2/S)·j·(re + j·im) = (2/S)·(−im + j·re)
    spectrum.push({
      order: n,
      amplitude: (2 / size) * Math.hypot(re, im),
      phase: Math.atan2(re, -im),
    });
  }
  return spectrum;
}
