import type { Waveform } from '../waveform/Waveform.js';
import { runningIntegral } from '../waveform/runningIntegral.js';
import { waveformMean } from '../waveform/waveformMean.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';

/*
 * The whole-waveform distortion ratios (`waveformThd`, `waveformWthd`) once the fundamental is
 * known: each public function reads it with one exact sum of its own; the design report reads it
 * once for both. Internal (not exported from the package).
 */

/**
 * {@link waveformThd} of a validated waveform whose fundamental amplitude V₁ > 0 (peak volts) the
 * caller has read already (`fundamentalAmplitude`). Internal: the design report.
 */
export function waveformThdOfFundamental(waveform: Waveform, fundamental: number): number {
  const mean = waveformMean(waveform);
  const remainder = waveformMeanSquare(waveform) - mean * mean - (fundamental * fundamental) / 2;
  // Rounding can leave a tiny negative remainder for a waveform with (almost) no distortion.
  return Math.sqrt(Math.max(0, 2 * remainder)) / fundamental;
}

/**
 * {@link waveformWthd} of a validated waveform whose fundamental amplitude V₁ > 0 (peak volts)
 * the caller has read already (`fundamentalAmplitude`). Internal: the design report.
 */
export function waveformWthdOfFundamental(waveform: Waveform, fundamental: number): number {
  const remainder = 2 * runningIntegral(waveform).variance - fundamental * fundamental;
  return Math.sqrt(Math.max(0, remainder)) / fundamental;
}
