import { TAU } from '../math.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { FFT_WINDOWS, type FftWindowName } from './FftWindowName.js';

/**
 * Cosine-sum coefficients a_k of each window, w(i) = Σ_k (−1)^k a_k cos(2πk·i/N).
 * - Hann: 0.5, 0.5 (F. J. Harris, "On the use of windows for harmonic analysis with the
 *   discrete Fourier transform", Proc. IEEE 66(1), 1978).
 * - Flat-top: the widely published five-term set 0.21557895, 0.41663158, 0.277263158,
 *   0.083578947, 0.006947368 (G. D'Antona and A. Ferrero, Digital Signal Processing for
 *   Measurement Systems, Springer, 2006; also the flat-top of common signal-processing
 *   libraries). Its coherent gain a₀ ≈ 0.2156 is the value docs/references.md attributes to Harris.
 */
export const WINDOW_COEFFICIENTS: Readonly<Record<FftWindowName, readonly number[]>> = {
  rectangular: [1],
  hann: [0.5, 0.5],
  'flat-top': [0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368],
};

/** Options of {@link fftWindow}. */
export interface FftWindowOptions {
  /** Which window. @default 'hann' */
  window?: FftWindowName;
}

/** The longest window {@link fftWindow} builds. */
export const MAX_WINDOW_LENGTH = 2 ** 22;

/**
 * The periodic ("DFT-even", as Harris recommends for spectral analysis) window of `length`
 * samples: w(i) = Σ_k (−1)^k a_k cos(2πk·i/length), i = 0 … length − 1. Its coherent gain
 * Σw/length equals a₀ exactly for length > number of terms.
 *
 * @param length - samples, an integer in [1, 4194304]
 * @returns a plain array of weights (dimensionless)
 */
export function fftWindow(length: number, options: FftWindowOptions = {}): number[] {
  const { window = 'hann' } = options;
  assertNumberInRange('length', length, { min: 1, max: MAX_WINDOW_LENGTH, integer: true });
  assertOneOf('window', window, FFT_WINDOWS);
  const coefficients = WINDOW_COEFFICIENTS[window];
  const weights = new Array<number>(length);
  for (let i = 0; i < length; i++) {
    let w = 0;
    coefficients.forEach((a, k) => {
      w += (k % 2 === 0 ? a : -a) * Math.cos((TAU * k * i) / length);
    });
    weights[i] = w;
  }
  return weights;
}
