import { TAU } from '../math.js';

/**
 * Refines an estimate f̂ of a capture's fundamental from how far its phase advances between the
 * first and the last stretch of one period: each stretch of B = round(fs/f̂) samples is correlated
 * with e^{−j2πf̂t}, and as the fundamental's phase at sample s is 2πf·s/fs + φ, the phase
 * difference Δ between stretches D samples apart gives f = (Δ + 2πk)·fs/(2πD), k the whole turn
 * that keeps f nearest f̂ (the phase-difference method of frequency estimation; e.g. the phase
 * vocoder, J. L. Flanagan and R. M. Golden, Bell System Technical Journal, 1966, from memory).
 *
 * Each stretch holds one period of f̂, so the other harmonics and the negative-frequency image
 * leak into it only in proportion to f − f̂; the spectral-peak estimate of a capture of two or
 * three periods (where a window's main lobe reaches DC and the neighbouring harmonics) is biased
 * by far more than that, and two passes of this remove most of its error.
 *
 * @param samples - the capture
 * @param sampleRate - hertz
 * @param estimate - f̂, hertz, from the spectral peak
 * @returns the refined fundamental, hertz; `estimate` itself when less than 1.5 periods fit or
 *   the fundamental has no amplitude
 * Internal: part of fftSpectrum.
 */
export function refineFundamental(
  samples: readonly number[],
  sampleRate: number,
  estimate: number,
): number {
  let frequency = estimate;
  for (let pass = 0; pass < 2; pass++) {
    const block = Math.round(sampleRate / frequency);
    const last = samples.length - block;
    // The stretches may overlap; half a period between them is enough to read the advance.
    if (block < 2 || 2 * last < block) return frequency;
    const first = correlate(samples, 0, block, frequency / sampleRate);
    const final = correlate(samples, last, block, frequency / sampleRate);
    if (Math.hypot(first.re, first.im) === 0 || Math.hypot(final.re, final.im) === 0)
      return frequency;
    const advance = Math.atan2(final.im, final.re) - Math.atan2(first.im, first.re);
    const turns = Math.round((frequency * last) / sampleRate - advance / TAU);
    const refined = ((advance + TAU * turns) * sampleRate) / (TAU * last);
    // A refinement that moves more than a tenth of the estimate is not one: keep the estimate.
    if (!(Math.abs(refined - frequency) < 0.1 * frequency)) return frequency;
    frequency = refined;
  }
  return frequency;
}

/**
 * (Σ x[start + i]·sin α_i, Σ x[start + i]·cos α_i) with α_i = 2π·cyclesPerSample·i: for
 * x = A·sin(α + ψ) over one period its angle is ψ, the fundamental's phase at sample `start`.
 */
function correlate(
  samples: readonly number[],
  start: number,
  length: number,
  cyclesPerSample: number,
): { re: number; im: number } {
  let re = 0;
  let im = 0;
  for (let i = 0; i < length; i++) {
    const x = samples[start + i] as number;
    const angle = TAU * cyclesPerSample * i;
    re += x * Math.sin(angle);
    im += x * Math.cos(angle);
  }
  return { re, im };
}
