import { MAX_SPAN_FUNDAMENTAL_PERIODS } from '../carrier/CarrierSpan.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import { assertWaveform } from '../waveform/assertWaveform.js';
import { runningIntegral } from '../waveform/runningIntegral.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformMean } from '../waveform/waveformMean.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';
import { fractionLabel } from './fractionLabel.js';
import { harmonics, MAX_HARMONIC_ORDER } from './harmonics.js';

/** One component of a waveform spanning q fundamental periods. */
export interface SubharmonicComponent {
  /** Frequency as a multiple of the fundamental, n/q (1 is the fundamental; 1/3 a sub-harmonic). */
  order: number;
  /** n: the harmonic order over the whole span (frequency n·f₁/q). */
  spanOrder: number;
  /** The order as a fraction in lowest terms, `1/3`, `2`, `47/3`, for charts and tables. */
  label: string;
  /** Peak volts, never negative (order 0: the mean's magnitude, phase 0 or π for its sign). */
  amplitude: number;
  /** Radians in (−π, π], relative to sin(order·θ) with θ the fundamental angle. */
  phase: number;
}

/** The spectrum and distortion of a waveform spanning q fundamental periods. */
export interface SubharmonicSpectrum {
  /** q, the fundamental periods the waveform spans. */
  fundamentalPeriods: number;
  /** Peak volts of the fundamental (span order q). */
  fundamental: number;
  /** Its phase, radians, relative to sin θ. */
  fundamentalPhase: number;
  /**
   * THD over the whole waveform: every component but the mean and the fundamental, the
   * sub-harmonics and non-integer orders included, exact by Parseval. A ratio.
   */
  thd: number;
  /** WTHD over the whole waveform, each component weighted by 1/order (order in fundamentals). A ratio. */
  wthd: number;
  /** Span orders 0..q·maxOrder, so fundamental orders 0 to maxOrder in steps of 1/q. */
  components: SubharmonicComponent[];
}

/** Options of {@link subharmonicSpectrum}. */
export interface SubharmonicSpectrumOptions {
  /** q, an integer in [1, 1000]: the fundamental periods the waveform spans. */
  fundamentalPeriods: number;
  /** Highest order in fundamentals, an integer ≥ 1; q·maxOrder ≤ 100000. */
  maxOrder: number;
}

/**
 * The spectrum of a waveform that repeats only after q fundamental periods (a carrier at an
 * asynchronous ratio mf = p/q, see `sineTriangle` and `threePhase` with `fundamentalPeriods`),
 * on the base frequency f₁/q: component n of the span is at n/q of the fundamental, computed
 * exactly from the switching angles by `harmonics`. THD and WTHD are over the whole q-period
 * waveform (Parseval, as `waveformThd` and `waveformWthd`):
 * THD = √(2·(⟨v²⟩ − V₀² − V_q²/2))/V_q and, with the span's running integral Φ whose variance is
 * Σ_{n≥1} (V_n/n)²/2, WTHD = q·√(2·var Φ − (V_q/q)²)/V_q, the weights 1/(n/q) of
 * WTHD = √(Σ (V_k/k)²)/V₁ (Holmes and Lipo, 2003, ch. 3) taken over every non-fundamental k.
 *
 * @param waveform - one span of q fundamental periods on [0, 2π), volts
 * @throws ParameterRangeError naming `fundamentalPeriods` or `maxOrder`, or when the fundamental is zero
 */
export function subharmonicSpectrum(
  waveform: Waveform,
  { fundamentalPeriods: q, maxOrder }: SubharmonicSpectrumOptions,
): SubharmonicSpectrum {
  assertWaveform(waveform);
  assertNumberInRange('fundamentalPeriods', q, {
    min: 1,
    max: MAX_SPAN_FUNDAMENTAL_PERIODS,
    integer: true,
  });
  assertNumberInRange('maxOrder', maxOrder, {
    min: 1,
    max: Math.floor(MAX_HARMONIC_ORDER / q),
    integer: true,
  });
  const spectrum = harmonics(waveform, q * maxOrder);
  const fundamental = spectrum[q]?.amplitude ?? 0;
  if (!(fundamental > 0)) {
    throw new ParameterRangeError('waveform', 'a waveform with a non-zero fundamental', 0);
  }
  const mean = waveformMean(waveform);
  const rest = waveformMeanSquare(waveform) - mean * mean - (fundamental * fundamental) / 2;
  const weighted = 2 * runningIntegral(waveform).variance - (fundamental / q) ** 2;
  return {
    fundamentalPeriods: q,
    fundamental,
    fundamentalPhase: spectrum[q]?.phase ?? 0,
    // Rounding can leave a tiny negative remainder for a waveform with almost no distortion.
    thd: Math.sqrt(Math.max(0, 2 * rest)) / fundamental,
    wthd: (q * Math.sqrt(Math.max(0, weighted))) / fundamental,
    components: spectrum.map(({ order: n, amplitude, phase }) => ({
      order: n / q,
      spanOrder: n,
      label: fractionLabel(n, q),
      amplitude,
      phase,
    })),
  };
}
