import FFT from 'fft.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';

/** What {@link periodSynthesiser} returns: one FFT of size S and its buffers, reused call after call. */
export interface PeriodSynthesiser {
  /** S, samples a period (a power of two). */
  readonly size: number;
  /** The `fft.js` transform of size S (for `sampledPhasors` on the same grid). */
  readonly fft: FFT;
  /** sin(2πj/S), j = 0..S−1 (cos(2πj/S) is sine[(j + S/4) mod S]). */
  readonly sine: Float64Array;
  /**
   * One period of x(θ) = X₀ + Σ_{n≥1} |X_n|·sin(nθ + arg X_n) for each of two phasor spectra
   * (orders 0..count − 1 of each; X₀ real; count at most S/2), sampled at the S angles 2πj/S,
   * written into the buffers of `slot` (see {@link PeriodSynthesiser.buffers}).
   * @returns the samples of `first`, and of `second` (null when it is null)
   */
  pair(
    first: HarmonicPhasors,
    second: HarmonicPhasors | null,
    count: number,
    slot: number,
  ): [Float64Array, Float64Array | null];
  /**
   * The two S-sample buffers the synthesiser keeps for `slot` (a small whole number, the
   * caller's), built on first use and overwritten by every later call with that slot: a caller
   * keeps nothing it returns in them beyond that. Reused from report to report (when the
   * synthesiser is the caller's plans'), they spare two typed arrays of S doubles a series.
   */
  buffers(slot: number): readonly [Float64Array, Float64Array];
}

/**
 * A synthesiser of sampled periods from harmonic phasors, by the inverse DFT through one `fft.js`
 * transform of size S, built once for a report and reused for each of its series (building the
 * transform's tables is as costly as a transform). Two real series x and y go through one complex
 * transform as z = x + j·y (the standard two-for-one packing; E. O. Brigham, "The Fast Fourier
 * Transform and its Applications", 1988, ch. 9): with the two-sided coefficients of x,
 * c_n/2 and conj(c_n)/2 at ±n where c_n = X_n·e^{−jπ/2} (sin φ = Re e^{j(φ − π/2)}), and likewise
 * d_n of y, z has Z_{±n} = (c_{±n} + j·d_{±n})/2, and the forward transform of conj(Z) gives
 * conj(z): x = Re, y = −Im. S from {@link synthesisSize}, so no harmonic aliases.
 * Internal: used for the time series of the filtered design figures.
 * @param fft - a transform of size S to build on (its tables cost as much as a transform)
 */
export function periodSynthesiser(size: number, fft: FFT = new FFT(size)): PeriodSynthesiser {
  if (fft.size !== size) throw new RangeError(`fft.size ${fft.size} is not ${size}`);
  const input = new Float64Array(2 * size);
  const output = new Float64Array(2 * size);
  const sine = new Float64Array(size);
  // The highest order the last call wrote into `input` (its other entries are zero).
  let written = 0;
  // Read as the missing second series (count ≤ S/2), never written.
  const zeros = new Float64Array(size / 2);
  const kept: (readonly [Float64Array, Float64Array])[] = [];
  const buffers = (slot: number): readonly [Float64Array, Float64Array] => {
    let found = kept[slot];
    if (found === undefined) {
      found = [new Float64Array(size), new Float64Array(size)];
      kept[slot] = found;
    }
    return found;
  };
  // fft.js's table holds cos(2πk/S) and −sin(2πk/S) at 2k, 2k + 1: no trigonometry of our own.
  const table = fft.table as number[];
  for (let k = 0; k < size; k++) sine[k] = -(table[2 * k + 1] as number);
  const pair = (
    first: HarmonicPhasors,
    second: HarmonicPhasors | null,
    count: number,
    slot: number,
  ): [Float64Array, Float64Array | null] => {
    const highest = count - 1;
    if (2 * highest + 2 > size) throw new RangeError(`order ${highest} aliases at ${size} samples`);
    // Every order up to `highest` is written below: only the last call's orders above it are
    // cleared, not the whole buffer.
    if (written > highest) {
      input.fill(0, 2 * highest + 2, 2 * written + 2);
      input.fill(0, 2 * (size - written), 2 * (size - highest));
    }
    written = highest;
    const { re: xRe, im: xIm } = first;
    const { re: yRe, im: yIm } = second ?? { re: zeros, im: zeros };
    // Order 0: Z₀ = X₀ + j·Y₀, both real; conj(Z₀) goes in.
    input[0] = xRe[0] as number;
    input[1] = -(yRe[0] as number);
    for (let n = 1; n <= highest; n++) {
      // c = X·e^{−jπ/2} = x.im − j·x.re; d likewise from y.
      const cr = xIm[n] as number;
      const ci = -(xRe[n] as number);
      const dr = yIm[n] as number;
      const di = -(yRe[n] as number);
      // Z_n = (c + j·d)/2, Z_{−n} = (conj c + j·conj d)/2; their conjugates go in.
      input[2 * n] = (cr - di) / 2;
      input[2 * n + 1] = -(ci + dr) / 2;
      input[2 * (size - n)] = (cr + di) / 2;
      input[2 * (size - n) + 1] = -(dr - ci) / 2;
    }
    fft.transform(output, input);
    const [x, ySamples] = buffers(slot);
    const y = second === null ? null : ySamples;
    for (let j = 0; j < size; j++) x[j] = output[2 * j] as number;
    if (y !== null) for (let j = 0; j < size; j++) y[j] = -(output[2 * j + 1] as number);
    return [x, y];
  };
  return { size, fft, sine, pair, buffers };
}

/** The FFT size for {@link periodSynthesiser}: the smallest power of two ≥ 2·highestOrder + 2 and ≥ minimumSamples. */
export function synthesisSize(highestOrder: number, minimumSamples: number): number {
  let size = 4;
  while (size < 2 * highestOrder + 2 || size < minimumSamples) size *= 2;
  return size;
}
