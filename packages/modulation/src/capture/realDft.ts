import FFT from 'fft.js';

/**
 * The discrete Fourier transform of a real record of any length L ≥ 2, in double precision:
 * X_k = Σ_{i=0}^{L−1} x_i·e^{−j2πki/L} for k = 0 … ⌊L/2⌋, interleaved as [re₀, im₀, re₁, im₁, …].
 *
 * A power-of-two length goes straight to the `fft.js` package (radix-4). Any other length is
 * computed exactly (not approximated, not padded) by the chirp-z transform: with
 * w_k = e^{−jπk²/L}, X_k = w_k·Σ_i (x_i·w_i)·conj(w_{k−i}), a circular convolution evaluated
 * with `fft.js` at the next power of two ≥ 2L − 1 (L. I. Bluestein, "A linear filtering approach
 * to the computation of discrete Fourier transform", IEEE Trans. Audio Electroacoustics, 1970;
 * L. R. Rabiner, R. W. Schafer, C. M. Rader, "The chirp z-transform algorithm", same journal,
 * 1969). Its rounding error grows like that of the FFTs it uses (about 1e−13 of the largest
 * bin at a million samples). The registry's any-length packages were not used: kissfft-js
 * computes in single precision (2e−7 relative error measured on the 10 000-sample square wave
 * of docs/methods.md, short of the 1e−9 a periodic capture must read to) and ndarray-fft
 * generates code at run time.
 *
 * @param samples - the record, real, length ≥ 2
 * @returns the one-sided transform, 2·(⌊L/2⌋ + 1) numbers
 */
export function realDft(samples: ArrayLike<number>): number[] {
  const length = samples.length;
  const kept = 2 * (Math.floor(length / 2) + 1);
  if ((length & (length - 1)) === 0) {
    const fft = new FFT(length);
    const out = fft.createComplexArray() as number[];
    fft.realTransform(out, Array.from(samples));
    return out.slice(0, kept);
  }
  let size = 1;
  while (size < 2 * length - 1) size *= 2;
  const fft = new FFT(size);
  // Chirp e^{−jπk²/L}; k² is reduced mod 2L first so the angle keeps full precision.
  const chirpRe = new Float64Array(length);
  const chirpIm = new Float64Array(length);
  for (let k = 0; k < length; k++) {
    const angle = (Math.PI * ((k * k) % (2 * length))) / length;
    chirpRe[k] = Math.cos(angle);
    chirpIm[k] = -Math.sin(angle);
  }
  const a = fft.createComplexArray() as number[];
  const b = fft.createComplexArray() as number[];
  a.fill(0);
  b.fill(0);
  for (let k = 0; k < length; k++) {
    const x = samples[k] as number;
    a[2 * k] = x * (chirpRe[k] as number);
    a[2 * k + 1] = x * (chirpIm[k] as number);
    // conj(w_k) at k and at size − k: the kernel of the circular convolution.
    b[2 * k] = chirpRe[k] as number;
    b[2 * k + 1] = -(chirpIm[k] as number);
    if (k > 0) {
      b[2 * (size - k)] = chirpRe[k] as number;
      b[2 * (size - k) + 1] = -(chirpIm[k] as number);
    }
  }
  const aHat = fft.createComplexArray() as number[];
  const bHat = fft.createComplexArray() as number[];
  fft.transform(aHat, a);
  fft.transform(bHat, b);
  for (let k = 0; k < size; k++) {
    const re = (aHat[2 * k] as number) * (bHat[2 * k] as number);
    const im = (aHat[2 * k + 1] as number) * (bHat[2 * k + 1] as number);
    const cross =
      (aHat[2 * k] as number) * (bHat[2 * k + 1] as number) +
      (aHat[2 * k + 1] as number) * (bHat[2 * k] as number);
    aHat[2 * k] = re - im;
    aHat[2 * k + 1] = cross;
  }
  const convolution = fft.createComplexArray() as number[];
  fft.inverseTransform(convolution, aHat);
  const out = new Array<number>(kept);
  for (let k = 0; k < kept / 2; k++) {
    const re = convolution[2 * k] as number;
    const im = convolution[2 * k + 1] as number;
    out[2 * k] = re * (chirpRe[k] as number) - im * (chirpIm[k] as number);
    out[2 * k + 1] = re * (chirpIm[k] as number) + im * (chirpRe[k] as number);
  }
  return out;
}
