import FFT from 'fft.js';
import type { Complex } from '../numeric/complex.js';

/**
 * Samples one period of x(θ) = X₀ + Σ_{n≥1} |X_n|·sin(nθ + arg X_n) at S = 2^k evenly spaced
 * angles 2πj/S, j = 0..S−1, from its phasors (index n holds X_n; X₀ is real), by one FFT (the
 * `fft.js` package); S from {@link synthesisSize}, so no harmonic aliases. sin(φ) = Re e^{j(φ − π/2)}, so the samples are the
 * real part of Σ X_n·e^{−jπ/2}·e^{jnθ}: the forward transform of the conjugates gives their
 * conjugate sum, whose real part is the same.
 * Internal: used for the time series of the filtered figures.
 */
export function synthesisePeriod(phasors: readonly Complex[], size: number): Float64Array {
  const highest = phasors.length - 1;
  const fft = new FFT(size);
  const input = fft.createComplexArray() as number[];
  const output = fft.createComplexArray() as number[];
  input[0] = phasors[0]?.re ?? 0;
  for (let n = 1; n <= highest; n++) {
    const { re, im } = phasors[n] as Complex;
    // X·e^{−jπ/2} = im − j·re; its conjugate is im + j·re.
    input[2 * n] = im;
    input[2 * n + 1] = re;
  }
  fft.transform(output, input);
  const samples = new Float64Array(size);
  for (let j = 0; j < size; j++) samples[j] = output[2 * j] as number;
  return samples;
}

/** The FFT size for {@link synthesisePeriod}: the smallest power of two ≥ 2·highestOrder + 2 and ≥ minimumSamples. */
export function synthesisSize(highestOrder: number, minimumSamples: number): number {
  let size = 4;
  while (size < 2 * highestOrder + 2 || size < minimumSamples) size *= 2;
  return size;
}
