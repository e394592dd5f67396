import { ParameterRangeError } from '../validation/errors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { runningIntegral } from '../waveform/runningIntegral.js';
import { waveformMean } from '../waveform/waveformMean.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';

/*
 * The whole-waveform distortion ratios (`waveformThd`, `waveformWthd`) once the fundamental is
 * known: the public functions read it with one exact sum; the design report has it already from
 * the spectrum it holds. Internal (not exported from the package).
 */

/**
 * The fundamental's amplitude (peak volts) as it is, when it is > 0: a distortion ratio's
 * denominator. Internal: callers that read the fundamental from a spectrum they hold.
 * @throws ParameterRangeError naming `waveform` when it is zero
 */
export function assertFundamental(amplitude: number): number {
  if (!(amplitude > 0)) {
    throw new ParameterRangeError(
      'waveform',
      'a waveform whose fundamental (order 1) has an amplitude > 0',
      amplitude,
    );
  }
  return amplitude;
}

/**
 * {@link waveformThd} of a validated waveform whose fundamental amplitude V₁ > 0 (peak volts) the
 * caller has read already from its exact spectrum. Internal: the design report.
 */
export function waveformThdOfFundamental(waveform: Waveform, fundamental: number): number {
  const mean = waveformMean(waveform);
  const remainder = waveformMeanSquare(waveform) - mean * mean - (fundamental * fundamental) / 2;
  // Rounding can leave a tiny negative remainder for a waveform with (almost) no distortion.
  return Math.sqrt(Math.max(0, 2 * remainder)) / fundamental;
}

/**
 * {@link waveformWthd} of a validated waveform whose fundamental amplitude V₁ > 0 (peak volts)
 * the caller has read already from its exact spectrum. Internal: the design report.
 */
export function waveformWthdOfFundamental(waveform: Waveform, fundamental: number): number {
  const remainder = 2 * runningIntegral(waveform).variance - fundamental * fundamental;
  return Math.sqrt(Math.max(0, remainder)) / fundamental;
}
