import FFT from 'fft.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';

/** What {@link periodSynthesiser} returns: its transforms and buffers, reused call after call. */
export interface PeriodSynthesiser {
  /** S, samples a period (a power of two). */
  readonly size: number;
  /** sin(2πj/S), j = 0..S−1 (cos(2πj/S) is sine[(j + S/4) mod S]). */
  readonly sine: Float64Array;
  /**
   * One period of x(θ) = X₀ + Σ_{n≥1} |X_n|·sin(nθ + arg X_n) for each of two phasor spectra
   * (orders 0..count − 1 of each; X₀ real; count at most S/2), sampled at the S angles 2πj/S,
   * written into the buffers of `slot` (see {@link PeriodSynthesiser.buffers}).
   * @returns the samples of `first`, of `second` (null when it is null), and whether both are
   * half-wave symmetric: every even order, the mean included, exactly zero in both, when the
   * samples at 2πj/S + π are the negated samples at 2πj/S, exactly (see {@link periodSynthesiser})
   */
  pair(
    first: HarmonicPhasors,
    second: HarmonicPhasors | null,
    count: number,
    slot: number,
  ): [Float64Array, Float64Array | null, boolean];
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
 *
 * Half-wave symmetric series (every even order zero, as the bridge voltages and currents of
 * carrier PWM at odd mf and of the other symmetric patterns have) take a transform of S/2: with
 * only odd orders n = 2k + 1, z_j = w^j·Σ_k Z_{2k+1}·(w²)^{kj}, w = e^{j2π/S}, an S/2-point
 * inverse DFT of the odd coefficients times a twiddle, and z_{j+S/2} = −z_j (w^{S/2} = −1): the
 * odd-frequency half of the decimation-in-frequency split, run backwards (Brigham, 1988; from
 * memory). The first S/2 samples are so computed and the others are their negatives.
 * Internal: used for the time series of the filtered design figures.
 * @param fft - a transform of size S to build on (its tables cost as much as a transform)
 * @param transformOf - where the transform of S/2 comes from, asked once, on the first
 * half-wave series (the caller's plans share it with the DC link's spectrum)
 */
export function periodSynthesiser(
  size: number,
  fft: FFT = new FFT(size),
  transformOf: (size: number) => FFT = (n) => new FFT(n),
): PeriodSynthesiser {
  if (fft.size !== size) throw new RangeError(`fft.size ${fft.size} is not ${size}`);
  const half = size / 2;
  const input = new Float64Array(2 * size);
  const output = new Float64Array(2 * size);
  const sine = new Float64Array(size);
  // The half-wave transform of S/2 and its input, built when first needed; `output` serves it.
  let halfFft: FFT | null = null;
  let halfInput: Float64Array | null = null;
  // The highest order the last call wrote into `input` and into `halfInput` (their other
  // entries are zero).
  let written = 0;
  let halfWritten = 0;
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
  // conj(Z) of the two-for-one packing at order n, into `into` at complex index `at`.
  const put = (
    into: Float64Array,
    at: number,
    n: number,
    x: HarmonicPhasors,
    y: HarmonicPhasors,
    negative: boolean,
  ): void => {
    // c = X·e^{−jπ/2} = x.im − j·x.re; d likewise from y.
    const cr = x.im[n] as number;
    const ci = -(x.re[n] as number);
    const dr = y.im[n] as number;
    const di = -(y.re[n] as number);
    // Z_n = (c + j·d)/2, Z_{−n} = (conj c + j·conj d)/2; their conjugates go in.
    if (negative) {
      into[2 * at] = (cr + di) / 2;
      into[2 * at + 1] = -(dr - ci) / 2;
    } else {
      into[2 * at] = (cr - di) / 2;
      into[2 * at + 1] = -(ci + dr) / 2;
    }
  };
  // The samples of x into xOut and of y into yOut (when not null) through the transform of S.
  const whole = (
    x: HarmonicPhasors,
    y: HarmonicPhasors,
    highest: number,
    xOut: Float64Array,
    yOut: Float64Array | null,
  ): void => {
    // Every order up to `highest` is written below: only the last call's orders above it are
    // cleared, not the whole buffer.
    if (written > highest) {
      input.fill(0, 2 * highest + 2, 2 * written + 2);
      input.fill(0, 2 * (size - written), 2 * (size - highest));
    }
    written = highest;
    // Order 0: Z₀ = X₀ + j·Y₀, both real; conj(Z₀) goes in.
    input[0] = x.re[0] as number;
    input[1] = -(y.re[0] as number);
    for (let n = 1; n <= highest; n++) {
      put(input, n, n, x, y, false);
      put(input, size - n, n, x, y, true);
    }
    fft.transform(output, input);
    for (let j = 0; j < size; j++) xOut[j] = output[2 * j] as number;
    if (yOut !== null) for (let j = 0; j < size; j++) yOut[j] = -(output[2 * j + 1] as number);
  };
  // The half-wave transform: conj(Z_{2k+1}) at k and conj(Z_{−(2k+1)}) at S/2 − 1 − k; the
  // forward transform F gives conj(z_j) = F_j·w^{−j}, j < S/2, and z_{j+S/2} = −z_j.
  const halfWave = (
    x: HarmonicPhasors,
    y: HarmonicPhasors,
    highest: number,
    xOut: Float64Array,
    yOut: Float64Array | null,
  ): void => {
    halfFft ??= transformOf(half);
    halfInput ??= new Float64Array(size);
    const into = halfInput;
    const top = (highest - 1) >> 1;
    if (halfWritten > top) {
      into.fill(0, 2 * top + 2, 2 * halfWritten + 2);
      into.fill(0, 2 * (half - 1 - halfWritten), 2 * (half - 1 - top));
    }
    halfWritten = top;
    for (let k = 0; k <= top; k++) {
      put(into, k, 2 * k + 1, x, y, false);
      put(into, half - 1 - k, 2 * k + 1, x, y, true);
    }
    halfFft.transform(output, into);
    const quarter = size / 4;
    for (let j = 0; j < half; j++) {
      const re = output[2 * j] as number;
      const im = output[2 * j + 1] as number;
      const s = sine[j] as number;
      const c = sine[j + quarter] as number;
      // x = Re z = Re conj(z), y = −Im conj(z), conj(z) = (re + j·im)·(c − j·s).
      const xj = re * c + im * s;
      xOut[j] = xj;
      xOut[j + half] = -xj;
      if (yOut !== null) {
        const yj = re * s - im * c;
        yOut[j] = yj;
        yOut[j + half] = -yj;
      }
    }
  };
  const pair = (
    first: HarmonicPhasors,
    second: HarmonicPhasors | null,
    count: number,
    slot: number,
  ): [Float64Array, Float64Array | null, boolean] => {
    const highest = count - 1;
    if (2 * highest + 2 > size) throw new RangeError(`order ${highest} aliases at ${size} samples`);
    const y = second ?? { re: zeros, im: zeros };
    const [xSamples, ySamples] = buffers(slot);
    const yOut = second === null ? null : ySamples;
    const symmetric = evenOrdersZero(first, highest) && evenOrdersZero(y, highest);
    if (symmetric) halfWave(first, y, highest, xSamples, yOut);
    else whole(first, y, highest, xSamples, yOut);
    return [xSamples, yOut, symmetric];
  };
  return { size, sine, pair, buffers };
}

/** Whether orders 0, 2, 4, … up to `highest` of the phasors are all exactly zero. */
function evenOrdersZero({ re, im }: HarmonicPhasors, highest: number): boolean {
  if (re[0] !== 0) return false;
  for (let n = 2; n <= highest; n += 2) if (re[n] !== 0 || im[n] !== 0) return false;
  return true;
}

/** The FFT size for {@link periodSynthesiser}: the smallest power of two ≥ 2·highestOrder + 2 and ≥ minimumSamples. */
export function synthesisSize(highestOrder: number, minimumSamples: number): number {
  let size = 4;
  while (size < 2 * highestOrder + 2 || size < minimumSamples) size *= 2;
  return size;
}
