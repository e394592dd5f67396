import { weightedDistortion } from '../spectrum/distortion.js';
import type { LabelledHarmonic } from '../spectrum/labelHarmonics.js';
import { fundamentalAmplitude } from '../spectrum/fundamentalAmplitude.js';
import {
  waveformThdOfFundamental,
  waveformWthdOfFundamental,
} from '../spectrum/wholeWaveformDistortion.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';
import type { VoltageFigures } from './DesignReport.js';
import type { NamedVoltage } from './modulationVoltages.js';

/**
 * The figures of one piecewise-constant voltage given its labelled spectrum (orders
 * 0..maxOrder, index = order, exact): fundamental and its phase from the spectrum, RMS, THD and
 * WTHD exact over the whole waveform (`waveformThd`, `waveformWthd`), and the THD of only the
 * shown orders. Internal: `voltageFigures` and the design report (which reads its spectra once
 * for all its voltages, `designVoltagePhasors`).
 * @throws ParameterRangeError when the fundamental is zero
 */
export function labelledVoltageFigures(
  voltage: NamedVoltage,
  spectrum: LabelledHarmonic[],
): VoltageFigures {
  const { name, waveform } = voltage;
  // The ratios' denominator is the waveform's own fundamental (which checks the waveform), read
  // once for both, as `waveformThd` reads it: a report's spectra are combined from the legs,
  // equal to it to rounding only, and one voltage gets one whole-waveform THD from every route.
  const ownFundamental = fundamentalAmplitude(waveform);
  const thd = waveformThdOfFundamental(waveform, ownFundamental);
  const fundamental = spectrum[1] as LabelledHarmonic;
  return {
    name,
    fundamental: fundamental.amplitude,
    fundamentalPhase: fundamental.phase,
    rms: Math.sqrt(waveformMeanSquare(waveform)),
    thd,
    thdUpperBound: thd,
    wthd: waveformWthdOfFundamental(waveform, ownFundamental),
    exact: true,
    spectrum,
    spectrumThd: weightedDistortion(spectrum, 0),
  };
}
