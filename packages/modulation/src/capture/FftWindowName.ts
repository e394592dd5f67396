/**
 * Analysis windows for {@link fftSpectrum}:
 * - `'rectangular'`: no weighting; exact for coherent captures, large scalloping otherwise.
 * - `'hann'`: raised cosine, coherent gain 0.5 (F. J. Harris, Proc. IEEE 66(1), 1978, Table I).
 * - `'flat-top'`: five-term cosine sum with coherent gain ≈ 0.2156 and amplitude flatness
 *   within about 0.01 dB across a bin, for reading amplitudes of non-coherent captures.
 */
export type FftWindowName = 'rectangular' | 'hann' | 'flat-top';

/** The windows {@link FftWindowName} allows. */
export const FFT_WINDOWS: readonly FftWindowName[] = ['rectangular', 'hann', 'flat-top'];
