import { TAU } from '../math.js';
import { thd } from '../spectrum/thd.js';
import { assertFiniteArray, assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { FFT_WINDOWS, type FftWindowName } from './FftWindowName.js';
import { fftWindow } from './fftWindow.js';
import { realDft } from './realDft.js';
import { refineFundamental } from './refineFundamental.js';
import { wholePeriods } from './wholePeriods.js';

/**
 * Which samples are transformed, and at what length: `'whole-periods'` the longest stretch of
 * whole fundamental periods, at exactly its length; `'zero-pad'` and `'truncate'` fit the capture
 * to a power of two (kept for comparison with instruments that do so).
 */
export type FftLengthPolicy = 'whole-periods' | 'zero-pad' | 'truncate';

/** The length policies {@link FftLengthPolicy} allows. */
export const FFT_LENGTH_POLICIES: readonly FftLengthPolicy[] = [
  'whole-periods',
  'zero-pad',
  'truncate',
];

/** Options of {@link fftSpectrum}. */
export interface FftSpectrumOptions {
  /**
   * Analysis window for a capture that is not exactly periodic (an exactly periodic one read
   * over whole periods needs none and is read with the rectangular window). @default 'hann'
   */
  window?: FftWindowName;
  /** Fundamental frequency, hertz, in (0, sampleRate/2). @default estimated from the strongest bin */
  fundamentalFrequency?: number;
  /** Highest harmonic order reported (orders at or above Nyquist are left out), integer in [1, 5000]. @default 50 */
  maxOrder?: number;
  /**
   * `'whole-periods'` transforms the longest stretch of whole fundamental periods at exactly its
   * length (see {@link wholePeriods}); `'zero-pad'` windows all samples and pads with zeros to
   * the next power of two (finer bins, same resolution); `'truncate'` keeps the first
   * 2^⌊log₂N⌋ samples. @default 'whole-periods'
   */
  lengthPolicy?: FftLengthPolicy;
}

/** One harmonic read from a capture. */
export interface CaptureHarmonic {
  /** Multiple of the fundamental (1 is the fundamental). */
  order: number;
  /** order × fundamentalFrequency, hertz. */
  frequency: number;
  /** Peak volts (or the capture's unit), window's coherent gain corrected. */
  amplitude: number;
  /** Radians in (−π, π], of amplitude·sin(2πft + phase) with t = 0 at the first sample. */
  phase: number;
}

/** Spectrum of a capture; a plain serialisable object. */
export interface FftSpectrum {
  /** Hertz, as given. */
  sampleRate: number;
  /** Samples analysed, from the first (the whole periods, or after truncation). */
  sampleCount: number;
  /** Transform length: sampleCount, or the power of two it was padded to. */
  fftSize: number;
  /** Whole fundamental periods in the samples analysed (0 when not one fits). */
  periods: number;
  /** True when the capture repeats exactly over `periods` (read with no window, exact bins). */
  periodic: boolean;
  /** Spacing of `bins.frequency`, sampleRate/fftSize, hertz. */
  binWidth: number;
  /** Resolution of the analysed record, sampleRate/sampleCount, hertz (one "bin" below). */
  resolution: number;
  /** The window applied: the one asked for, or `'rectangular'` for an exactly periodic capture. */
  window: FftWindowName;
  /** Σw/N of the window over the analysed samples (rectangular 1, Hann 0.5, flat-top ≈ 0.2156). */
  coherentGain: number;
  /** One-sided spectrum, 0 … sampleRate/2: hertz, peak amplitude, sine phase (radians). */
  bins: { frequency: number[]; amplitude: number[]; phase: number[] };
  /** Hertz: the given one, or the estimate. */
  fundamentalFrequency: number;
  /** True when `fundamentalFrequency` was estimated from the capture. */
  fundamentalEstimated: boolean;
  /** Orders 1 … min(maxOrder, last below Nyquist). */
  harmonics: CaptureHarmonic[];
  /** √(Σ_{n≥2} A_n²)/A_1 over the reported orders, a ratio; 0 when A_1 is 0. */
  thd: number;
}

/** Fewest samples accepted. */
export const MIN_CAPTURE_SAMPLES = 16;
/** Most samples accepted (bounds memory and time). */
export const MAX_CAPTURE_SAMPLES = 2 ** 21;
/** Highest harmonic order {@link fftSpectrum} reports (that of a design's default spectrum). */
export const MAX_CAPTURE_ORDER = 5000;

/** Half-width of each window's main lobe, in bins: the DC-leakage zone skipped by the estimate. */
const MAIN_LOBE_HALF_WIDTH: Readonly<Record<FftWindowName, number>> = {
  rectangular: 1,
  hann: 2,
  'flat-top': 5,
};

/** A harmonic sits on a bin ("coherent sampling") when its bin position is this close to an integer. */
const COHERENCE_TOLERANCE = 1e-6;

/**
 * Spectrum of an uploaded bench capture by discrete Fourier transform ({@link realDft}: the
 * `fft.js` package, through the chirp-z transform for lengths that are not powers of two), with
 * the window's coherent gain corrected so a sine of peak amplitude A reads back as A on its bin
 * (amplitude_k = 2|X_k|/Σw; F. J. Harris, Proc. IEEE 66(1), 1978, on coherent gain and
 * scalloping loss).
 *
 * With the default `'whole-periods'` policy the transform covers the longest stretch of whole
 * fundamental periods at exactly that length ({@link wholePeriods}). A capture that repeats
 * exactly over them is read with no window, its harmonics exactly on bins, and its fundamental
 * frequency (when estimated) is periods·sampleRate/samples: an exactly periodic capture reads
 * the exact DFT of its samples (for a ±V square wave with M samples a period,
 * 4V/(M·sin(πn/M)) on odd n, within (πn/M)²/6 of the series' 4V/(nπ)). Any other capture is
 * read with the window asked for over the whole periods that fit.
 *
 * Harmonic n is read at bin position p = n·f₀/binWidth: on the exact bin when p is within
 * 1e−6 of an integer (coherent sampling; exact for every window), otherwise as the largest
 * bin within ±1 resolution bin of p (then the amplitude is low by up to the window's
 * scalloping loss: rectangular 3.92 dB, Hann 1.42 dB (Harris, Table I), flat-top ≈ 0.01 dB).
 *
 * Without `fundamentalFrequency` it is estimated as the strongest bin above the DC leakage
 * zone, refined by golden-section search of the Hann-windowed DTFT's magnitude within ±1 bin
 * (relative error typically below 1e−5 for a clean tone spanning several periods), and with
 * `'whole-periods'` then by the fundamental's phase advance from the first period to the last
 * ({@link refineFundamental}), which a capture of only two or three periods needs.
 *
 * @param samples - the capture, one value per sample (volts), finite, at least 16, at most 2^21
 * @param sampleRate - hertz, > 0
 * @throws ParameterRangeError naming `samples[i]`, `samples.length`, `sampleRate`,
 *   `fundamentalFrequency`, `maxOrder`, `window` or `lengthPolicy`
 */
export function fftSpectrum(
  samples: readonly number[],
  sampleRate: number,
  options: FftSpectrumOptions = {},
): FftSpectrum {
  const {
    window = 'hann',
    fundamentalFrequency,
    maxOrder = 50,
    lengthPolicy = 'whole-periods',
  } = options;
  assertFiniteArray('samples', samples, MIN_CAPTURE_SAMPLES, MAX_CAPTURE_SAMPLES);
  assertNumberInRange('sampleRate', sampleRate, { min: 0, minExclusive: true });
  assertOneOf('window', window, FFT_WINDOWS);
  assertOneOf('lengthPolicy', lengthPolicy, FFT_LENGTH_POLICIES);
  assertNumberInRange('maxOrder', maxOrder, { min: 1, max: MAX_CAPTURE_ORDER, integer: true });
  if (fundamentalFrequency !== undefined) {
    assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
      min: 0,
      max: sampleRate / 2,
      minExclusive: true,
      maxExclusive: true,
    });
  }
  if (lengthPolicy !== 'whole-periods') {
    const power = Math.log2(samples.length);
    const fftSize = 2 ** (lengthPolicy === 'zero-pad' ? Math.ceil(power) : Math.floor(power));
    const sampleCount = Math.min(samples.length, fftSize);
    const transform = windowedTransform(samples, sampleCount, fftSize, window, sampleRate);
    const f0 =
      fundamentalFrequency ??
      estimateFundamental(
        transform.bins.amplitude,
        samples,
        sampleCount,
        sampleRate,
        fftSize,
        window,
      );
    const periods = Math.floor((sampleCount * f0) / sampleRate);
    return spectrumResult(
      transform,
      f0,
      fundamentalFrequency === undefined,
      periods,
      false,
      maxOrder,
    );
  }
  let f0 = fundamentalFrequency;
  if (f0 === undefined) {
    // The estimate needs only the strongest bin's neighbourhood: a padded power of two is quicker.
    const size = 2 ** Math.ceil(Math.log2(samples.length));
    const padded = windowedTransform(samples, samples.length, size, 'hann', sampleRate);
    f0 = refineFundamental(
      samples,
      sampleRate,
      estimateFundamental(padded.bins.amplitude, samples, samples.length, sampleRate, size, 'hann'),
    );
  }
  const span = wholePeriods(samples, sampleRate, f0);
  if (span.periodic && fundamentalFrequency === undefined) {
    f0 = (span.periods * sampleRate) / span.length;
  }
  const used = span.periodic ? 'rectangular' : window;
  const transform = windowedTransform(samples, span.length, span.length, used, sampleRate);
  return spectrumResult(
    transform,
    f0,
    fundamentalFrequency === undefined,
    span.periods,
    span.periodic,
    maxOrder,
  );
}

/** The first `sampleCount` samples windowed, padded with zeros to `size`, and transformed. */
interface WindowedTransform {
  sampleRate: number;
  sampleCount: number;
  size: number;
  window: FftWindowName;
  weightSum: number;
  out: number[];
  bins: FftSpectrum['bins'];
}

function windowedTransform(
  samples: readonly number[],
  sampleCount: number,
  size: number,
  window: FftWindowName,
  sampleRate: number,
): WindowedTransform {
  const weights = fftWindow(sampleCount, { window });
  const weighted = new Float64Array(size);
  let weightSum = 0;
  for (let i = 0; i < sampleCount; i++) {
    weighted[i] = (samples[i] as number) * (weights[i] as number);
    weightSum += weights[i] as number;
  }
  const out = realDft(weighted);
  const bins = oneSidedBins(out, size, sampleRate, weightSum);
  return { sampleRate, sampleCount, size, window, weightSum, out, bins };
}

function spectrumResult(
  transform: WindowedTransform,
  f0: number,
  estimated: boolean,
  periods: number,
  periodic: boolean,
  maxOrder: number,
): FftSpectrum {
  const { sampleRate, sampleCount, size, window, weightSum, bins, out } = transform;
  const resolution = sampleRate / sampleCount;
  const binWidth = sampleRate / size;
  const harmonicList = readHarmonics(
    bins,
    out,
    size,
    weightSum,
    f0,
    binWidth,
    resolution,
    maxOrder,
    sampleRate,
  );
  const fundamental = harmonicList[0];
  const distortion =
    fundamental !== undefined && fundamental.amplitude > 0
      ? thd(harmonicList.map(({ order, amplitude, phase }) => ({ order, amplitude, phase })))
      : 0;
  return {
    sampleRate,
    sampleCount,
    fftSize: size,
    periods,
    periodic,
    binWidth,
    resolution,
    window,
    coherentGain: weightSum / sampleCount,
    bins,
    fundamentalFrequency: f0,
    fundamentalEstimated: estimated,
    harmonics: harmonicList,
    thd: distortion,
  };
}

/** Bins 0 … ⌊size/2⌋ as frequency, peak amplitude (2|X|/Σw; DC and Nyquist |X|/Σw), sine phase. */
function oneSidedBins(
  out: readonly number[],
  fftSize: number,
  sampleRate: number,
  weightSum: number,
): FftSpectrum['bins'] {
  const half = Math.floor(fftSize / 2);
  const nyquist = fftSize % 2 === 0 ? half : -1;
  const frequency: number[] = [];
  const amplitude: number[] = [];
  const phase: number[] = [];
  for (let k = 0; k <= half; k++) {
    const re = out[2 * k] as number;
    const im = out[2 * k + 1] as number;
    const scale = k === 0 || k === nyquist ? 1 : 2;
    frequency.push((k * sampleRate) / fftSize);
    amplitude.push((scale * Math.hypot(re, im)) / weightSum);
    phase.push(k === 0 ? 0 : sinePhase(re, im));
  }
  return { frequency, amplitude, phase };
}

/** X_k = (A·Σw/2)·e^{j(φ − π/2)} for A·sin(ωt + φ), so φ = arg X + π/2, wrapped to (−π, π]. */
function sinePhase(re: number, im: number): number {
  const phase = Math.atan2(im, re) + Math.PI / 2;
  return phase > Math.PI ? phase - TAU : phase;
}

function readHarmonics(
  bins: FftSpectrum['bins'],
  out: readonly number[],
  fftSize: number,
  weightSum: number,
  f0: number,
  binWidth: number,
  resolution: number,
  maxOrder: number,
  sampleRate: number,
): CaptureHarmonic[] {
  const half = Math.floor(fftSize / 2);
  const reach = resolution / binWidth; // one resolution bin in FFT bins (1 unless zero-padded)
  const result: CaptureHarmonic[] = [];
  for (let order = 1; order <= maxOrder; order++) {
    const frequency = order * f0;
    if (frequency >= sampleRate / 2) break;
    const position = frequency / binWidth;
    const nearest = Math.round(position);
    let chosen = nearest;
    if (Math.abs(position - nearest) > COHERENCE_TOLERANCE * reach) {
      const first = Math.max(1, Math.ceil(position - reach));
      const last = Math.min(half, Math.floor(position + reach));
      chosen = first;
      for (let k = first; k <= last; k++)
        if ((bins.amplitude[k] as number) > (bins.amplitude[chosen] as number)) chosen = k;
    }
    const re = out[2 * chosen] as number;
    const im = out[2 * chosen + 1] as number;
    const scale = chosen === half && fftSize % 2 === 0 ? 1 : 2;
    result.push({
      order,
      frequency,
      amplitude: (scale * Math.hypot(re, im)) / weightSum,
      phase: sinePhase(re, im),
    });
  }
  return result;
}

/**
 * Strongest bin above the DC leakage zone, refined by golden section on the magnitude of the
 * Hann-windowed DTFT within ±1 bin. Hann is used for the estimate whatever the analysis window:
 * its main lobe is unimodal (a flat-top's ripples would trap the search) and its side lobes
 * fall fast (the rectangular window's negative-frequency image would bias the peak).
 */
function estimateFundamental(
  amplitude: readonly number[],
  samples: readonly number[],
  sampleCount: number,
  sampleRate: number,
  fftSize: number,
  window: FftWindowName,
): number {
  const reach = fftSize / sampleCount;
  const skip = Math.ceil(Math.max(MAIN_LOBE_HALF_WIDTH[window], MAIN_LOBE_HALF_WIDTH.hann) * reach);
  let best = Math.min(skip, amplitude.length - 2);
  for (let k = best; k < amplitude.length - 1; k++)
    if ((amplitude[k] as number) > (amplitude[best] as number)) best = k;
  const hann = fftWindow(sampleCount, { window: 'hann' });
  const weighted = hann.map((w, i) => w * (samples[i] as number));
  const magnitude = (bin: number): number => {
    // Windowed DTFT at a fractional bin of the (padded) FFT grid, over the analysed samples. The
    // phasor is advanced by one rotation a sample and set afresh every 1024 samples, so its
    // rounding stays near 1e−13 while a cosine and sine are computed only once a block.
    const step = (TAU * bin) / fftSize;
    const rotateRe = Math.cos(step);
    const rotateIm = -Math.sin(step);
    let re = 0;
    let im = 0;
    let phasorRe = 1;
    let phasorIm = 0;
    for (let i = 0; i < sampleCount; i++) {
      if (i % 1024 === 0) {
        phasorRe = Math.cos(step * i);
        phasorIm = -Math.sin(step * i);
      }
      const w = weighted[i] as number;
      re += w * phasorRe;
      im += w * phasorIm;
      const nextRe = phasorRe * rotateRe - phasorIm * rotateIm;
      phasorIm = phasorRe * rotateIm + phasorIm * rotateRe;
      phasorRe = nextRe;
    }
    return Math.hypot(re, im);
  };
  let low = Math.max(0.5, best - reach);
  let high = Math.min(Math.floor(fftSize / 2) - 0.5, best + reach);
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = high - ratio * (high - low);
  let b = low + ratio * (high - low);
  let ma = magnitude(a);
  let mb = magnitude(b);
  for (let i = 0; i < 60 && high - low > 1e-9; i++) {
    if (ma > mb) {
      high = b;
      b = a;
      mb = ma;
      a = high - ratio * (high - low);
      ma = magnitude(a);
    } else {
      low = a;
      a = b;
      ma = mb;
      b = low + ratio * (high - low);
      mb = magnitude(b);
    }
  }
  return (0.5 * (low + high) * sampleRate) / fftSize;
}
