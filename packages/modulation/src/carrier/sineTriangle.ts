import { assertOneOf } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import { subtractWaveforms } from '../waveform/subtractWaveforms.js';
import { assertCarrierSpan } from './assertCarrierSpan.js';
import type { CarrierSampling } from './CarrierSampling.js';
import type { CarrierSpan } from './CarrierSpan.js';
import { compareWithCarrier } from './compareWithCarrier.js';
import type { ReferenceSignal } from './ReferenceSignal.js';
import { sineReference } from './sineReference.js';
import { spanCarrier } from './spanCarrier.js';

/** The two single-phase H-bridge schemes. */
export type BridgeScheme = 'bipolar' | 'unipolar';

/** The schemes, in the order the API and the dashboard list them. */
export const BRIDGE_SCHEMES: readonly BridgeScheme[] = ['bipolar', 'unipolar'];

/** Options of {@link sineTriangle}. */
export interface SineTriangleOptions {
  /**
   * `bipolar`: two-level, the bridge output switches between +vdc and −vdc.
   * `unipolar`: three-level (+vdc, 0, −vdc); leg a compares +ref and leg b compares −ref with
   * the same carrier, and the output is leg a − leg b.
   */
  scheme: BridgeScheme;
  /** Modulation index: the reference is `ma·sin θ`; above 1 is overmodulation. Range (0, 1000]. */
  ma: number;
  /**
   * Frequency ratio: carrier cycles per fundamental period, an integer in [1, 10000]; over a
   * span of q fundamental periods (the second argument) any p/q with p ≤ 10000 whole.
   */
  mf: number;
  /** DC bus voltage (volts), > 0. */
  vdc: number;
  /** @default 'natural' */
  sampling?: CarrierSampling;
  /**
   * Carrier delay in radians of the carrier cycle; 0 puts a carrier valley at θ = π/2, which for
   * odd mf gives quarter-wave symmetry (Holmes and Lipo, 2003, ch. 3).
   * @default 0
   */
  carrierPhase?: number;
}

/**
 * The output voltage of a single-phase H-bridge under sine-triangle PWM, one fundamental
 * period, exact (no time step). The output is +vdc while the reference is above the carrier.
 *
 * In the linear range (ma ≤ 1) the fundamental is ma·vdc in phase with sin θ; its sidebands sit
 * round m·mf ± n, with amplitudes given by the double Fourier series of H. S. Black, *Modulation
 * Theory*, 1953, and Holmes and Lipo, *Pulse Width Modulation for Power Converters*, 2003,
 * ch. 3. Past ma = 1 pulses drop and the waveform tends to a square wave.
 *
 * Asynchronous (non-integer) ratio mf = p/q: with `span.fundamentalPeriods` = q the waveform
 * covers q fundamental periods on [0, 2π) (p carrier cycles), exact as above; its order q is
 * the fundamental and order n lies at n/q of the fundamental frequency, so the sub-harmonics
 * and non-integer sidebands m·p/q ± n of the double Fourier series appear (Holmes and Lipo,
 * 2003, ch. 3). See `subharmonicSpectrum`.
 *
 * @throws ParameterRangeError naming `scheme`, `ma`, `mf`, `vdc`, `sampling`, `carrierPhase`
 *   or `fundamentalPeriods`
 */
export function sineTriangle(options: SineTriangleOptions, span: CarrierSpan = {}): Waveform {
  assertOneOf('scheme', options.scheme, BRIDGE_SCHEMES);
  assertCarrierSpan(options, span);
  const { scheme, ma, mf, vdc, sampling = 'natural', carrierPhase = 0 } = options;
  const { fundamentalPeriods = 1 } = span;
  const compare = (reference: ReferenceSignal, low: number): Waveform => {
    const restated = spanCarrier(reference, { mf, carrierPhase }, fundamentalPeriods);
    return compareWithCarrier(restated.reference, {
      ...restated.alignment,
      sampling,
      high: vdc,
      low,
    });
  };
  if (scheme === 'bipolar') return compare(sineReference(ma), -vdc);
  return subtractWaveforms(compare(sineReference(ma), 0), compare(sineReference(-ma), 0));
}
