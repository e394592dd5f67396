/**
 * How many fundamental periods a carrier waveform covers. A frequency ratio mf = p/q that is not
 * a whole number repeats only after q fundamental periods (and p carrier cycles), so its exact
 * waveform spans q periods, mapped onto [0, 2π): the fundamental is then harmonic order q of the
 * span and order n is at n/q of the fundamental frequency (sub-harmonics for n < q).
 */
export interface CarrierSpan {
  /** q, an integer in [1, {@link MAX_SPAN_FUNDAMENTAL_PERIODS}]; q·mf must be whole. @default 1 */
  fundamentalPeriods?: number;
}

/** The most fundamental periods one carrier waveform may span (bounds its cost with mf). */
export const MAX_SPAN_FUNDAMENTAL_PERIODS = 1000;
