import type { Harmonic } from '../spectrum/Harmonic.js';
import { assertNumberInRange } from '../validation/assertions.js';
import type { CaptureHarmonic } from './fftSpectrum.js';

/** Relative difference between the capture's and the design's fundamental frequency that is warned of, 1 %. */
export const CAPTURE_FREQUENCY_TOLERANCE = 0.01;

/**
 * Predictions below this fraction of the predicted fundamental get no measured/predicted ratio:
 * 0.1 %, about where a bench capture's noise, an 8- to 12-bit scope's quantisation and the
 * window's leakage decide the reading rather than the harmonic (common practice, no single
 * source). A ratio of two numbers that small says nothing about the prediction.
 */
export const CAPTURE_RATIO_FLOOR = 1e-3;

/** One order of a capture set against a prediction. */
export interface CaptureComparisonOrder {
  order: number;
  /** Hertz, of the capture's fundamental. */
  frequency: number;
  /** Peak volts read from the capture. */
  measured: number;
  /** Peak volts predicted. */
  predicted: number;
  /** measured − predicted, volts. */
  difference: number;
  /** measured/predicted, or null where the prediction is below `noiseFloor`. */
  ratio: number | null;
}

/** Options of {@link compareCapture}. */
export interface CompareCaptureOptions {
  /** The capture's fundamental, hertz, > 0. */
  measuredFrequency: number;
  /** The design's fundamental, hertz, > 0. */
  predictedFrequency: number;
  /** Highest order asked for (the orders compared stop below the capture's Nyquist frequency). */
  maxOrder: number;
  /** Fraction of the predicted fundamental below which no ratio is given. @default CAPTURE_RATIO_FLOOR */
  ratioFloor?: number;
  /**
   * q, an integer in [1, 1000]: the fundamental periods the prediction spans (a carrier at a
   * ratio p/q, `designSpanSpectrum`), so that `predicted[n]` is at order n/q. @default 1
   */
  fundamentalPeriods?: number;
}

/** A capture against a prediction; a plain serialisable object. */
export interface CaptureComparisonFigures {
  orders: CaptureComparisonOrder[];
  /** Volts: ratioFloor × the predicted fundamental; no ratio is given below it. */
  noiseFloor: number;
  /** The fraction of the predicted fundamental that `noiseFloor` is. */
  ratioFloor: number;
  /** (measured − predicted fundamental frequency)/predicted, a ratio. */
  frequencyMismatch: number;
  /**
   * RMS sum of the predicted components between whole orders (sub- and inter-harmonics n/q to
   * maxOrder, with `fundamentalPeriods` q > 1) over the predicted fundamental, a ratio: what the
   * comparison, read at whole orders, leaves out. 0 with q = 1.
   */
  uncomparedDistortion: number;
  /** Sentences a person can act on: frequencies that differ by more than 1 %, orders cut by Nyquist, components between whole orders. */
  warnings: string[];
}

/**
 * Sets the harmonics read from a capture ({@link fftSpectrum}) against a predicted spectrum,
 * order by order, and says when the comparison cannot be trusted: a capture whose fundamental
 * differs from the design's by more than {@link CAPTURE_FREQUENCY_TOLERANCE} (its orders are not
 * the design's), or a capture sampled too slowly to reach the orders asked for. The ratio column
 * is left empty (null) where the prediction is below the noise floor.
 *
 * A prediction over a span of q fundamental periods (a carrier that is no whole multiple of the
 * fundamental) has components at every n/q; a capture is read at whole orders only (`fftSpectrum`
 * over whole fundamental periods), so each whole order is compared with the prediction's
 * component at that order, and the components between them are summed (RMS) into
 * `uncomparedDistortion` and named in a warning: a window over whole fundamental periods but not
 * whole spans leaks part of their energy into the neighbouring whole-order bins (Harris, 1978,
 * "On the use of windows for harmonic analysis with the DFT", Proc. IEEE 66(1)), so a measured
 * whole order may read above its prediction there.
 *
 * @param measured - the capture's harmonics, orders 1 … (peak volts)
 * @param predicted - the prediction indexed by order times q (index 0 the mean), peak volts
 * @throws ParameterRangeError naming `measuredFrequency`, `predictedFrequency`, `maxOrder`,
 *   `ratioFloor` or `fundamentalPeriods`
 */
export function compareCapture(
  measured: readonly CaptureHarmonic[],
  predicted: readonly Harmonic[],
  options: CompareCaptureOptions,
): CaptureComparisonFigures {
  const {
    measuredFrequency,
    predictedFrequency,
    maxOrder,
    ratioFloor = CAPTURE_RATIO_FLOOR,
    fundamentalPeriods: q = 1,
  } = options;
  assertNumberInRange('measuredFrequency', measuredFrequency, { min: 0, minExclusive: true });
  assertNumberInRange('predictedFrequency', predictedFrequency, { min: 0, minExclusive: true });
  assertNumberInRange('maxOrder', maxOrder, { min: 1, integer: true });
  assertNumberInRange('ratioFloor', ratioFloor, { min: 0, max: 1 });
  assertNumberInRange('fundamentalPeriods', q, { min: 1, max: 1000, integer: true });
  const fundamental = predicted[q]?.amplitude ?? 0;
  const noiseFloor = ratioFloor * fundamental;
  const orders = measured.map((h): CaptureComparisonOrder => {
    const expected = predicted[h.order * q]?.amplitude ?? 0;
    return {
      order: h.order,
      frequency: h.frequency,
      measured: h.amplitude,
      predicted: expected,
      difference: h.amplitude - expected,
      ratio: expected > noiseFloor && expected > 0 ? h.amplitude / expected : null,
    };
  });
  const frequencyMismatch = (measuredFrequency - predictedFrequency) / predictedFrequency;
  const warnings: string[] = [];
  if (Math.abs(frequencyMismatch) > CAPTURE_FREQUENCY_TOLERANCE) {
    warnings.push(
      `The capture's fundamental (${round(measuredFrequency)} Hz) differs from the study's ` +
        `(${round(predictedFrequency)} Hz) by ${round(100 * Math.abs(frequencyMismatch))} %, ` +
        `more than ${100 * CAPTURE_FREQUENCY_TOLERANCE} %: the measured orders are not the ` +
        `study's. Check that the capture belongs to this study, or give the fundamental frequency.`,
    );
  }
  const last = orders.at(-1)?.order ?? 0;
  if (last < maxOrder) {
    warnings.push(
      `The capture's sample rate reaches order ${last} only (its Nyquist frequency is below ` +
        `order ${last + 1}); orders ${last + 1} to ${maxOrder} are not compared. Capture at a ` +
        `higher sample rate to compare the carrier groups above.`,
    );
  }
  let between = 0;
  for (let n = 1; n <= Math.min(q * maxOrder, predicted.length - 1); n++)
    if (n % q !== 0) between += (predicted[n]?.amplitude ?? 0) ** 2;
  const uncomparedDistortion = fundamental > 0 ? Math.sqrt(between) / fundamental : 0;
  if (q > 1) {
    warnings.push(
      `The study's carrier is no whole multiple of its fundamental: its pattern repeats every ` +
        `${q} fundamental periods and it has components at every 1/${q} of the fundamental ` +
        `(sub- and inter-harmonics, ${round(100 * uncomparedDistortion)} % of the fundamental ` +
        `RMS-summed to order ${maxOrder}). The capture is read at whole orders only, so these ` +
        `are not compared, and their leakage into the whole-order bins may make a measured ` +
        `order read above its prediction.`,
    );
  }
  return { orders, noiseFloor, ratioFloor, frequencyMismatch, uncomparedDistortion, warnings };
}

/** Four significant figures for a sentence. */
function round(value: number): string {
  return String(Number(value.toPrecision(4)));
}
